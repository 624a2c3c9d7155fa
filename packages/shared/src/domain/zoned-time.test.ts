import { describe, expect, it } from 'vitest';
import { canShowTimeZone, describeTimeZone, instantOfWallTime, offsetMinutesAt, shortZoneName, startOfDayIn, wallTimeAt } from './zoned-time.ts';

/*
 * Offsets and summer-time dates below are facts of the IANA tz database (zones America/Los_Angeles,
 * Europe/London, Australia/Sydney, Asia/Kolkata), which the browser's Intl data is built from:
 * - America/Los_Angeles is UTC−8 (PST) in winter and UTC−7 (PDT) in summer; US summer time runs from
 *   02:00 on the second Sunday in March to 02:00 on the first Sunday in November (US Energy Policy Act of
 *   2005, from memory), i.e. 8 March and 1 November in 2026.
 * - Europe/London is UTC+0 in winter and UTC+1 in summer (clocks change at 01:00 UTC, last Sundays of
 *   March and October).
 * - Australia/Sydney is UTC+11 in December and UTC+10 in July (southern summer).
 * - Asia/Kolkata is UTC+5:30 all year.
 */
const LA = 'America/Los_Angeles';

describe('offset of a zone from UTC', () => {
  it('follows summer time in both hemispheres and keeps half-hour zones', () => {
    expect(offsetMinutesAt(new Date('2026-12-12T03:00:00Z'), LA)).toBe(-8 * 60);
    expect(offsetMinutesAt(new Date('2026-07-12T02:00:00Z'), LA)).toBe(-7 * 60);
    expect(offsetMinutesAt(new Date('2026-12-12T03:00:00Z'), 'Europe/London')).toBe(0);
    expect(offsetMinutesAt(new Date('2026-07-12T03:00:00Z'), 'Europe/London')).toBe(60);
    expect(offsetMinutesAt(new Date('2026-12-12T03:00:00Z'), 'Australia/Sydney')).toBe(11 * 60);
    expect(offsetMinutesAt(new Date('2026-07-12T03:00:00Z'), 'Australia/Sydney')).toBe(10 * 60);
    expect(offsetMinutesAt(new Date('2026-07-12T03:00:00.750Z'), 'Asia/Kolkata')).toBe(5 * 60 + 30);
    expect(offsetMinutesAt(new Date('2026-07-12T03:00:00Z'), 'UTC')).toBe(0);
  });

  it('changes at the moment the clocks do', () => {
    expect(offsetMinutesAt(new Date('2026-03-08T09:59:00Z'), LA)).toBe(-480);
    expect(offsetMinutesAt(new Date('2026-03-08T10:00:00Z'), LA)).toBe(-420);
    expect(offsetMinutesAt(new Date('2026-11-01T08:59:00Z'), LA)).toBe(-420);
    expect(offsetMinutesAt(new Date('2026-11-01T09:00:00Z'), LA)).toBe(-480);
  });
});

describe('wall-clock time in the guild’s zone → the instant', () => {
  it('reads 7 PM on a December evening in Los Angeles as 03:00 UTC the next day', () => {
    const wall = { year: 2026, month: 12, day: 11, hour: 19, minute: 0 };
    expect(instantOfWallTime(wall, LA)?.toISOString()).toBe('2026-12-12T03:00:00.000Z');
  });

  it('uses the summer offset in July', () => {
    const wall = { year: 2026, month: 7, day: 11, hour: 19, minute: 0 };
    expect(instantOfWallTime(wall, LA)?.toISOString()).toBe('2026-07-12T02:00:00.000Z');
  });

  it('takes the offset of the day itself on either side of a change', () => {
    // The Saturday before and the Sunday after summer time starts.
    expect(instantOfWallTime({ year: 2026, month: 3, day: 7, hour: 19, minute: 0 }, LA)?.toISOString()).toBe('2026-03-08T03:00:00.000Z');
    expect(instantOfWallTime({ year: 2026, month: 3, day: 8, hour: 19, minute: 0 }, LA)?.toISOString()).toBe('2026-03-09T02:00:00.000Z');
    // The Saturday before and the Sunday after it ends.
    expect(instantOfWallTime({ year: 2026, month: 10, day: 31, hour: 19, minute: 0 }, LA)?.toISOString()).toBe('2026-11-01T02:00:00.000Z');
    expect(instantOfWallTime({ year: 2026, month: 11, day: 1, hour: 19, minute: 0 }, LA)?.toISOString()).toBe('2026-11-02T03:00:00.000Z');
  });

  it('refuses a time the clocks skip when summer time starts', () => {
    expect(instantOfWallTime({ year: 2026, month: 3, day: 8, hour: 2, minute: 30 }, LA)).toBeNull();
    expect(instantOfWallTime({ year: 2026, month: 3, day: 8, hour: 3, minute: 0 }, LA)?.toISOString()).toBe('2026-03-08T10:00:00.000Z');
  });

  it('means the first of the two 1:30s when summer time ends', () => {
    expect(instantOfWallTime({ year: 2026, month: 11, day: 1, hour: 1, minute: 30 }, LA)?.toISOString()).toBe('2026-11-01T08:30:00.000Z');
  });

  it('works east of UTC and at half hours', () => {
    expect(instantOfWallTime({ year: 2026, month: 12, day: 11, hour: 19, minute: 0 }, 'Australia/Sydney')?.toISOString()).toBe('2026-12-11T08:00:00.000Z');
    expect(instantOfWallTime({ year: 2026, month: 12, day: 11, hour: 19, minute: 0 }, 'Asia/Kolkata')?.toISOString()).toBe('2026-12-11T13:30:00.000Z');
  });

  it('refuses dates that do not exist', () => {
    expect(instantOfWallTime({ year: 2026, month: 2, day: 31, hour: 19, minute: 0 }, LA)).toBeNull();
    expect(instantOfWallTime({ year: 2026, month: 12, day: 11, hour: 24, minute: 0 }, LA)).toBeNull();
  });

  it('gives back the wall time it was given', () => {
    for (const zone of [LA, 'Europe/London', 'Australia/Sydney', 'Asia/Kolkata', 'UTC']) {
      for (const month of [1, 4, 7, 10]) {
        const wall = { year: 2027, month, day: 15, hour: 18, minute: 45 };
        expect(wallTimeAt(instantOfWallTime(wall, zone)!, zone)).toEqual(wall);
      }
    }
  });
});

describe('naming the zone', () => {
  it('gives the short name readers know, which changes with summer time', () => {
    expect(shortZoneName(new Date('2026-12-12T03:00:00Z'), LA)).toBe('PST');
    expect(shortZoneName(new Date('2026-07-12T02:00:00Z'), LA)).toBe('PDT');
    expect(shortZoneName(new Date('2026-07-12T02:00:00Z'), 'UTC')).toBe('UTC');
  });

  it('describes the zone by its everyday name and its tz database name', () => {
    expect(describeTimeZone(LA, new Date('2026-12-12T03:00:00Z'))).toBe('Pacific Time (America/Los Angeles)');
  });

  it('knows which zones exist', () => {
    expect(canShowTimeZone(LA)).toBe(true);
    expect(canShowTimeZone('Ferncombe/Village_Hall')).toBe(false);
  });
});

describe('the instant a day begins in a zone', () => {
  it('is that day’s midnight there, on either side of a change of the clocks, and steps over months and years', () => {
    // 1 November 2026 is the day summer time ends in Los Angeles (see above): it begins at 00:00 PDT, UTC−7.
    expect(startOfDayIn(2026, 11, 1, LA).toISOString()).toBe('2026-11-01T07:00:00.000Z');
    expect(startOfDayIn(2026, 11, 2, LA).toISOString()).toBe('2026-11-02T08:00:00.000Z');
    expect(startOfDayIn(2026, 7, 12, 'Asia/Kolkata').toISOString()).toBe('2026-07-11T18:30:00.000Z');
    // Month 13 is January of the next year; day 31 of November is 1 December.
    expect(startOfDayIn(2026, 13, 1, 'UTC').toISOString()).toBe('2027-01-01T00:00:00.000Z');
    expect(startOfDayIn(2026, 11, 31, LA).toISOString()).toBe('2026-12-01T08:00:00.000Z');
  });
});
