import { instantOfWallTime, isCalendarWallTime, type MeetingView, offsetMinutesAt, shortZoneName, type WallTime, wallTimeAt } from '@scrap-relay/shared';

/**
 * Dates with times (meetings, offer deadlines, ticks at the door, ledger entries). The API sends instants; people
 * read and type them in the guild's time zone (the zone its e-mails use, `useGuildTimeZone()`), whatever the
 * device's clock says, and every time shown names its zone. The zone is always given: nothing here falls back
 * to the device's.
 */

const formats = new Map<string, Intl.DateTimeFormat>();

const OPTIONS: Record<'full' | 'dated' | 'short' | 'compact' | 'time', Intl.DateTimeFormatOptions> = {
  full: { dateStyle: 'full', timeStyle: 'short' },
  dated: { day: 'numeric', month: 'long', year: 'numeric', hour: 'numeric', minute: '2-digit', timeZoneName: 'short' },
  short: { weekday: 'short', day: 'numeric', month: 'short', hour: 'numeric', minute: '2-digit', timeZoneName: 'short' },
  compact: { day: 'numeric', month: 'short', year: 'numeric', hour: 'numeric', minute: '2-digit', timeZoneName: 'short' },
  time: { hour: 'numeric', minute: '2-digit', timeZoneName: 'short' },
};

function formatIn(kind: keyof typeof OPTIONS, timeZone: string): Intl.DateTimeFormat {
  const key = `${kind}:${timeZone}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', { ...OPTIONS[kind], timeZone });
    formats.set(key, format);
  }
  return format;
}

/** "Friday, December 11, 2026 at 7:00 PM PST" (the e-mails' wording), in the given zone. */
export function formatDateTime(iso: string, timeZone: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return `${formatIn('full', timeZone).format(date)} ${shortZoneName(date, timeZone)}`;
}

/** When a meeting starts, in full (the same wording as any other date and time). */
export const formatMeetingWhen = formatDateTime;

/** A formatter of one kind: an instant in the given zone, or the text as it came when it is not a date. */
const formatterOf =
  (kind: keyof typeof OPTIONS) =>
  (iso: string, timeZone: string): string => {
    const date = new Date(iso);
    return Number.isNaN(date.getTime()) ? iso : formatIn(kind, timeZone).format(date);
  };

/** "December 11, 2026 at 7:00 PM PST" — when something happened (an order's history). */
export const formatTimestamp = formatterOf('dated');

/** "Fri, Dec 11, 7:00 PM PST" — for lists and menus where space is short. */
export const formatShortDateTime = formatterOf('short');

/** "Dec 2, 2026, 10:24 AM PST" — for table cells (the ledger), where the year matters and space is short. */
export const formatCompactTimestamp = formatterOf('compact');

/** "3:42 PM PST" — the time of something that happened today (a draft saved a moment ago). */
export const formatTimeOfDay = formatterOf('time');

/** One line naming a meeting: when, then where. */
export const meetingLabel = (meeting: Pick<MeetingView, 'startsAt' | 'place'>, timeZone: string): string =>
  `${formatShortDateTime(meeting.startsAt, timeZone)} — ${meeting.place}`;

const pad = (n: number, width = 2) => String(Math.abs(n)).padStart(width, '0');

/**
 * An instant as ISO 8601 with the zone's offset (2026-12-10T19:00:00-08:00), so the time the officer typed
 * is still readable in what is sent. `offsetMinutes` is east of UTC (as in the written offset).
 */
export function toIsoWithOffset(date: Date, offsetMinutes: number): string {
  const local = new Date(date.getTime() + offsetMinutes * 60_000);
  const sign = offsetMinutes < 0 ? '-' : '+';
  const offset = `${sign}${pad(Math.trunc(offsetMinutes / 60))}:${pad(offsetMinutes % 60)}`;
  return (
    `${local.getUTCFullYear()}-${pad(local.getUTCMonth() + 1)}-${pad(local.getUTCDate())}` +
    `T${pad(local.getUTCHours())}:${pad(local.getUTCMinutes())}:00${offset}`
  );
}

const LOCAL_INPUT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/** What a datetime-local input's value says ("2026-12-10T19:00"), or null when it is not a real date and time. */
export function readLocalInput(value: string): WallTime | null {
  const match = LOCAL_INPUT.exec(value.trim());
  if (!match) return null;
  const [, year, month, day, hour, minute] = match.map(Number) as [number, number, number, number, number, number];
  const wall = { year, month, day, hour, minute };
  return isCalendarWallTime(wall) ? wall : null;
}

export type LocalInputReading = { ok: true; iso: string } | { ok: false; reason: 'incomplete' | 'skipped' };

/**
 * A datetime-local value, read as wall-clock time in `timeZone`, as an ISO instant with that zone's offset
 * on that date (summer time included). `skipped`: the clocks go forward past that time on that day, so it
 * never happens there.
 */
export function localInputToIso(value: string, timeZone: string): LocalInputReading {
  const wall = readLocalInput(value);
  if (!wall) return { ok: false, reason: 'incomplete' };
  const instant = instantOfWallTime(wall, timeZone);
  if (!instant) return { ok: false, reason: 'skipped' };
  return { ok: true, iso: toIsoWithOffset(instant, offsetMinutesAt(instant, timeZone)) };
}

/** An ISO instant as the value a datetime-local input shows: wall-clock time in `timeZone`. */
export function isoToLocalInput(iso: string, timeZone: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  const wall = wallTimeAt(date, timeZone);
  return `${pad(wall.year, 4)}-${pad(wall.month)}-${pad(wall.day)}T${pad(wall.hour)}:${pad(wall.minute)}`;
}

/** Whether the meeting has started: after that, the sheet is about what did not happen. */
export const meetingHasStarted = (meeting: Pick<MeetingView, 'startsAt'>, now: Date = new Date()): boolean =>
  new Date(meeting.startsAt).getTime() <= now.getTime();
