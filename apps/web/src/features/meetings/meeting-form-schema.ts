import { meetingSchema } from '@scrap-relay/shared';
import { z } from 'zod';
import { localInputToIso } from '../../utils/meetings.ts';

/**
 * The API's meeting schema, fed from a datetime-local input: the form holds the
 * wall-clock time the member typed (their browser's zone) and the schema turns it
 * into the ISO instant with offset that `meetingSchema` requires.
 */
export const meetingFormSchema = meetingSchema.extend({
  startsAt: z
    .string()
    .transform((value, ctx) => {
      const iso = localInputToIso(value);
      if (iso === null) {
        ctx.addIssue({ code: 'custom', message: 'Choose the date and the time the meeting starts.' });
        return z.NEVER;
      }
      return iso;
    })
    .pipe(meetingSchema.shape.startsAt),
});

export type MeetingFormValues = z.input<typeof meetingFormSchema>;
