import { afterEach, describe, expect, it } from 'vitest';
import { formatCalendarDate, formatDate } from './format.ts';

/** Node reads TZ afresh when it changes: the device's zone for what the test runs next. */
const deviceZoneAtStart = process.env.TZ;
const setDeviceZone = (zone: string) => {
  process.env.TZ = zone;
};
afterEach(() => {
  if (deviceZoneAtStart === undefined) delete process.env.TZ;
  else process.env.TZ = deviceZoneAtStart;
});

/*
 * Offsets are facts of the IANA tz database, which the browser's Intl data is built from: Pacific/Auckland is
 * UTC+13 in the southern summer (New Zealand daylight time, late September to early April), America/Los_Angeles
 * is UTC−8 in winter.
 */
describe('the day an instant falls on, in the guild’s zone', () => {
  it('dates an instant by the guild’s calendar, not the device’s', () => {
    // A device 14 hours ahead of UTC (Pacific/Kiritimati, UTC+14) would already call every one of these the next day.
    setDeviceZone('Pacific/Kiritimati');
    // 11:30 UTC on 30 November is 00:30 on 1 December in Auckland, and 3:30 AM on 30 November in Los Angeles.
    expect(formatDate('2026-11-30T11:30:00Z', 'Pacific/Auckland')).toBe('December 1, 2026');
    expect(formatDate('2026-11-30T11:30:00Z', 'America/Los_Angeles')).toBe('November 30, 2026');
    // 07:00 UTC on 1 December is still 30 November (11 PM) in Los Angeles.
    expect(formatDate('2026-12-01T07:00:00Z', 'America/Los_Angeles')).toBe('November 30, 2026');
    expect(formatDate('2026-12-01T07:00:00Z', 'UTC')).toBe('December 1, 2026');
  });

  it('gives back text that is not a date as it came', () => {
    expect(formatDate('not a date', 'UTC')).toBe('not a date');
  });
});

describe('a calendar date with no time', () => {
  it('names the same day whatever the zone of the device', () => {
    // The two ends of the world's clocks: UTC+14 and UTC−12 (Etc/GMT+12; the sign of Etc zones is reversed).
    for (const zone of ['Pacific/Kiritimati', 'Etc/GMT+12', 'UTC']) {
      setDeviceZone(zone);
      expect(formatCalendarDate('2026-11-01')).toBe('November 1, 2026');
      expect(formatCalendarDate('2026-12-31')).toBe('December 31, 2026');
    }
  });

  it('gives back what is not a real calendar date as it came', () => {
    expect(formatCalendarDate('2026-02-30')).toBe('2026-02-30');
    expect(formatCalendarDate('30/11/2026')).toBe('30/11/2026');
    expect(formatCalendarDate('')).toBe('');
  });
});
