import { describeTimeZone, meetingSchema } from '@scrap-relay/shared';
import { z } from 'zod';
import { localInputToIso } from '../../utils/meetings.ts';

/**
 * The API's meeting schema, fed from a datetime-local input: the form holds the wall-clock time the officer
 * typed, which is the guild's time (its zone, whatever the device's clock says), and the schema turns it
 * into the ISO instant with that zone's offset on that date that `meetingSchema` requires.
 */
export function meetingFormSchemaFor(timeZone: string) {
  return meetingSchema.extend({
    startsAt: z
      .string()
      .transform((value, ctx) => {
        const reading = localInputToIso(value, timeZone);
        if (reading.ok) return reading.iso;
        ctx.addIssue({
          code: 'custom',
          message:
            reading.reason === 'skipped'
              ? `On that day the clocks in ${describeTimeZone(timeZone)} jump forward past this time, so it never happens there: choose another time.`
              : 'Choose the date and the time the meeting starts.',
        });
        return z.NEVER;
      })
      .pipe(meetingSchema.shape.startsAt),
  });
}

export type MeetingFormValues = z.input<ReturnType<typeof meetingFormSchemaFor>>;
