import type { Meeting } from '../db/models/index.ts';

/** How a meeting reads in an e-mail: date and time in UTC, and the place. */
export const meetingLabel = (meeting: Pick<Meeting, 'startsAt' | 'place'>) =>
  `${meeting.startsAt.toISOString().slice(0, 16).replace('T', ' ')} UTC, ${meeting.place}`;
