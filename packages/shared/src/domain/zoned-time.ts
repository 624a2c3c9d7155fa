/**
 * Wall-clock time in a named (IANA) time zone, with Intl only. The guild keeps its meetings in its own zone,
 * which need not be the zone of the device someone reads them on, so nothing here uses the device's zone
 * unless asked to. Shared: the web app draws times with it, the API writes the ledger's CSV with it.
 */

/** A date and time as a clock on the wall shows it: month 1–12, hour 0–23. */
export interface WallTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
}

const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;

const partsFormats = new Map<string, Intl.DateTimeFormat>();

function partsFormat(timeZone: string): Intl.DateTimeFormat {
  let format = partsFormats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    partsFormats.set(timeZone, format);
  }
  return format;
}

/** Whether Intl knows the zone (a guild setting saved by an older build, or a typo, must not break a page). */
export function canShowTimeZone(timeZone: string): boolean {
  try {
    partsFormat(timeZone);
    return true;
  } catch {
    return false;
  }
}

/** What a clock in `timeZone` shows at `instant`, to the second. */
export function wallClockAt(instant: Date, timeZone: string): WallTime & { second: number } {
  const fields: Record<string, number> = {};
  for (const part of partsFormat(timeZone).formatToParts(instant)) {
    if (part.type !== 'literal') fields[part.type] = Number(part.value);
  }
  return {
    year: fields.year ?? NaN,
    month: fields.month ?? NaN,
    day: fields.day ?? NaN,
    // Some engines wrote midnight as 24 before hourCycle existed.
    hour: (fields.hour ?? NaN) % 24,
    minute: fields.minute ?? NaN,
    second: fields.second ?? NaN,
  };
}

/** What a clock in `timeZone` shows at `instant`. */
export function wallTimeAt(instant: Date, timeZone: string): WallTime {
  const { year, month, day, hour, minute } = wallClockAt(instant, timeZone);
  return { year, month, day, hour, minute };
}

/** The zone's offset from UTC at `instant`, in minutes east of UTC (as written in "+01:00"): −480 for 8 hours behind. */
export function offsetMinutesAt(instant: Date, timeZone: string): number {
  const wall = wallClockAt(instant, timeZone);
  const asUtc = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute, wall.second);
  const wholeSeconds = Math.floor(instant.getTime() / 1000) * 1000;
  return Math.round((asUtc - wholeSeconds) / MINUTE);
}

const sameWallTime = (a: WallTime, b: WallTime) =>
  a.year === b.year && a.month === b.month && a.day === b.day && a.hour === b.hour && a.minute === b.minute;

/** Whether the fields name a real calendar date and clock time (no 31 February, no 25 o'clock). */
export function isCalendarWallTime(wall: WallTime): boolean {
  const date = new Date(Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute));
  return (
    wall.hour >= 0 &&
    wall.hour < 24 &&
    wall.minute >= 0 &&
    wall.minute < 60 &&
    date.getUTCFullYear() === wall.year &&
    date.getUTCMonth() === wall.month - 1 &&
    date.getUTCDate() === wall.day
  );
}

/**
 * The instant at which a clock in `timeZone` shows `wall`. Offsets change at most once around any given time
 * (summer time starts or ends), so the answer is the wall time less the offset in force a day before or a day
 * after it, whichever reads back as the same wall time. When the clocks go back the hour happens twice: the
 * first one is meant. When they go forward the skipped times never happen: null, so the caller can ask again
 * rather than guess.
 */
export function instantOfWallTime(wall: WallTime, timeZone: string): Date | null {
  if (!isCalendarWallTime(wall)) return null;
  const asUtc = Date.UTC(wall.year, wall.month - 1, wall.day, wall.hour, wall.minute);
  const candidates = [asUtc - DAY, asUtc + DAY]
    .map((near) => asUtc - offsetMinutesAt(new Date(near), timeZone) * MINUTE)
    .filter((at) => sameWallTime(wallTimeAt(new Date(at), timeZone), wall))
    .sort((a, b) => a - b);
  return candidates.length > 0 ? new Date(candidates[0]!) : null;
}

const zoneNameFormats = new Map<string, Intl.DateTimeFormat>();

/** The zone's short name at that instant as English readers know it: "PST", "PDT", "GMT+1", "UTC". */
export function shortZoneName(instant: Date, timeZone: string): string {
  const key = `short:${timeZone}`;
  let format = zoneNameFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' });
    zoneNameFormats.set(key, format);
  }
  return format.formatToParts(instant).find((part) => part.type === 'timeZoneName')?.value ?? timeZone;
}

/** The zone's everyday name, with its IANA name for the unsure: "Pacific Time (America/Los Angeles)". */
export function describeTimeZone(timeZone: string, at: Date = new Date()): string {
  const key = `long:${timeZone}`;
  let format = zoneNameFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longGeneric' });
    zoneNameFormats.set(key, format);
  }
  const generic = format.formatToParts(at).find((part) => part.type === 'timeZoneName')?.value;
  const iana = timeZone.replaceAll('_', ' ');
  return generic && generic !== timeZone && generic !== iana ? `${generic} (${iana})` : iana;
}

/**
 * The instant a calendar day begins in `timeZone`: its midnight, or the first hour that happens when the clocks
 * skip midnight (as PostgreSQL reads a skipped time). Month and day may run over (month 13 is January of the
 * next year, day 32 the 1st or 2nd of the next month), so callers can step by months and days.
 */
export function startOfDayIn(year: number, month: number, day: number, timeZone: string): Date {
  const date = new Date(Date.UTC(year, month - 1, day));
  const wall = { year: date.getUTCFullYear(), month: date.getUTCMonth() + 1, day: date.getUTCDate(), minute: 0 };
  for (let hour = 0; hour < 24; hour++) {
    const at = instantOfWallTime({ ...wall, hour }, timeZone);
    if (at) return at;
  }
  throw new RangeError(`No hour of ${date.toISOString().slice(0, 10)} happens in ${timeZone}.`);
}
