import type { MeetingView } from '@scrap-relay/shared';

/**
 * Dates with times (meetings, offer deadlines, ticks at the door). The API sends
 * instants; people read and type them in their own (the browser's) time zone, so
 * every conversion here goes through that zone.
 */

const whenFormat = new Intl.DateTimeFormat('en', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  hour: 'numeric',
  minute: '2-digit',
});

const shortFormat = new Intl.DateTimeFormat('en', { weekday: 'short', day: 'numeric', month: 'short', hour: 'numeric', minute: '2-digit' });

/** "Thursday, 10 December 2026 at 7:00 PM", in the reader's time zone. */
export function formatDateTime(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : whenFormat.format(date);
}

/** When a meeting starts, in full (the same wording as any other date and time). */
export const formatMeetingWhen = formatDateTime;

/** "Thu 10 Dec, 7:00 PM" — for lists and menus where space is short. */
export function formatShortDateTime(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : shortFormat.format(date);
}

/** One line naming a meeting: when, then where. */
export const meetingLabel = (meeting: Pick<MeetingView, 'startsAt' | 'place'>): string =>
  `${formatShortDateTime(meeting.startsAt)} — ${meeting.place}`;

const pad = (n: number, width = 2) => String(Math.abs(n)).padStart(width, '0');

/**
 * An instant as ISO 8601 with the zone's offset (2026-12-10T19:00:00+01:00), so the
 * time the member typed is still readable in what is sent. `offsetMinutes` is east of
 * UTC (as in the written offset); by default the browser's for that date (summer time included).
 */
export function toIsoWithOffset(date: Date, offsetMinutes = -date.getTimezoneOffset()): string {
  const local = new Date(date.getTime() + offsetMinutes * 60_000);
  const sign = offsetMinutes < 0 ? '-' : '+';
  const offset = `${sign}${pad(Math.trunc(offsetMinutes / 60))}:${pad(offsetMinutes % 60)}`;
  return (
    `${local.getUTCFullYear()}-${pad(local.getUTCMonth() + 1)}-${pad(local.getUTCDate())}` +
    `T${pad(local.getUTCHours())}:${pad(local.getUTCMinutes())}:00${offset}`
  );
}

const LOCAL_INPUT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/**
 * A datetime-local value ("2026-12-10T19:00", wall-clock time in the browser's zone)
 * as an ISO instant with that zone's offset; null when it is not a complete date and time.
 */
export function localInputToIso(value: string): string | null {
  const match = LOCAL_INPUT.exec(value.trim());
  if (!match) return null;
  const [, y, mo, d, h, mi] = match.map(Number) as [number, number, number, number, number, number];
  const date = new Date(y, mo - 1, d, h, mi);
  // new Date rolls 31 February over into March; refuse instead of guessing.
  if (date.getFullYear() !== y || date.getMonth() !== mo - 1 || date.getDate() !== d) return null;
  return toIsoWithOffset(date);
}

/** An ISO instant as the value a datetime-local input shows (wall-clock time in the browser's zone). */
export function isoToLocalInput(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/** Whether the meeting has started (by the reader's clock): after that, the sheet is about what did not happen. */
export const meetingHasStarted = (meeting: Pick<MeetingView, 'startsAt'>, now: Date = new Date()): boolean =>
  new Date(meeting.startsAt).getTime() <= now.getTime();
