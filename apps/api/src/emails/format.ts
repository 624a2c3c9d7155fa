import type { Meeting } from '../db/models/index.ts';

/** A moment as an e-mail gives it, in the guild's time zone: "Tuesday, December 8, 2026 at 7:00 PM PST". */
export const formatWhen = (at: Date, timeZone: string) =>
  new Intl.DateTimeFormat('en-US', { timeZone, dateStyle: 'full', timeStyle: 'short' }).format(at) +
  ` ${new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(at).find((p) => p.type === 'timeZoneName')?.value ?? timeZone}`;

/** How a meeting reads in an e-mail: date and time in the guild's time zone, and the place. */
export const meetingLabel = (meeting: Pick<Meeting, 'startsAt' | 'place'>, timeZone: string) => `${formatWhen(meeting.startsAt, timeZone)}, ${meeting.place}`;
