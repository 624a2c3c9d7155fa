import { meetingSchema } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { formatCompactTimestamp, formatDateTime, formatShortDateTime, formatTimeOfDay, formatTimestamp, isoToLocalInput, localInputToIso, meetingHasStarted, meetingLabel, toIsoWithOffset } from './meetings.ts';

describe('meeting times with the zone offset written out', () => {
  const sevenPmUtc = new Date(Date.UTC(2026, 11, 10, 19, 0));

  it('writes the wall-clock time and offset of the given zone', () => {
    expect(toIsoWithOffset(sevenPmUtc, 0)).toBe('2026-12-10T19:00:00+00:00');
    expect(toIsoWithOffset(sevenPmUtc, 60)).toBe('2026-12-10T20:00:00+01:00');
    expect(toIsoWithOffset(sevenPmUtc, -300)).toBe('2026-12-10T14:00:00-05:00');
    // Half-hour zones keep their minutes, on either side of UTC.
    expect(toIsoWithOffset(sevenPmUtc, 330)).toBe('2026-12-11T00:30:00+05:30');
    expect(toIsoWithOffset(sevenPmUtc, -210)).toBe('2026-12-10T15:30:00-03:30');
  });

  it('names the same instant whatever the offset', () => {
    for (const offset of [-600, -210, 0, 60, 330, 780]) {
      expect(new Date(toIsoWithOffset(sevenPmUtc, offset)).getTime()).toBe(sevenPmUtc.getTime());
    }
  });

  it('is accepted by the API’s meeting schema', () => {
    const parsed = meetingSchema.safeParse({ startsAt: toIsoWithOffset(sevenPmUtc, -300), place: 'Church hall' });
    expect(parsed.success).toBe(true);
  });
});

describe('datetime-local input ↔ instant, in the guild’s time zone', () => {
  // America/Los_Angeles is UTC−8 in December and UTC−7 in July (IANA tz database); the device running
  // these tests may be in any zone, and none of this depends on it.
  const LA = 'America/Los_Angeles';

  it('reads the typed time as the guild’s wall-clock time and sends its offset on that date', () => {
    expect(localInputToIso('2026-12-11T19:00', LA)).toEqual({ ok: true, iso: '2026-12-11T19:00:00-08:00' });
    expect(localInputToIso('2026-07-11T19:00', LA)).toEqual({ ok: true, iso: '2026-07-11T19:00:00-07:00' });
    expect(localInputToIso('2026-12-11T19:00', 'UTC')).toEqual({ ok: true, iso: '2026-12-11T19:00:00+00:00' });
  });

  it('shows a meeting back in the guild’s zone, not the device’s', () => {
    expect(isoToLocalInput('2026-12-12T03:00:00Z', LA)).toBe('2026-12-11T19:00');
    expect(isoToLocalInput('2026-07-12T02:00:00Z', LA)).toBe('2026-07-11T19:00');
    expect(isoToLocalInput('2026-12-12T03:00:00Z', 'UTC')).toBe('2026-12-12T03:00');
  });

  it('round-trips whatever the zone', () => {
    for (const zone of [LA, 'Europe/London', 'Australia/Sydney', 'Asia/Kolkata']) {
      const reading = localInputToIso('2027-03-20T18:30', zone);
      expect(reading.ok).toBe(true);
      if (reading.ok) expect(isoToLocalInput(reading.iso, zone)).toBe('2027-03-20T18:30');
    }
  });

  it('refuses an incomplete or impossible date, and a time the clocks skip, instead of guessing', () => {
    expect(localInputToIso('', LA)).toEqual({ ok: false, reason: 'incomplete' });
    expect(localInputToIso('2026-12-10', LA)).toEqual({ ok: false, reason: 'incomplete' });
    expect(localInputToIso('2026-02-31T19:00', LA)).toEqual({ ok: false, reason: 'incomplete' });
    // US summer time starts at 02:00 on 8 March 2026 (second Sunday in March): 02:30 never happens.
    expect(localInputToIso('2026-03-08T02:30', LA)).toEqual({ ok: false, reason: 'skipped' });
    expect(isoToLocalInput('not a date', LA)).toBe('');
  });

  it('counts a meeting as started from its start time on', () => {
    const meeting = { startsAt: '2026-12-10T19:00:00Z' };
    expect(meetingHasStarted(meeting, new Date('2026-12-10T18:59:00Z'))).toBe(false);
    expect(meetingHasStarted(meeting, new Date('2026-12-10T19:00:00Z'))).toBe(true);
  });
});

describe('dates and times as people read them', () => {
  const LA = 'America/Los_Angeles';

  it('words a meeting as the e-mails do, in the guild’s zone, with the zone named', () => {
    // 03:00 UTC on 12 December is 7 PM on the 11th in Los Angeles (UTC−8 in winter, IANA tz database).
    expect(formatDateTime('2026-12-12T03:00:00Z', LA)).toBe('Friday, December 11, 2026 at 7:00 PM PST');
    expect(formatDateTime('2026-07-12T02:00:00Z', LA)).toBe('Saturday, July 11, 2026 at 7:00 PM PDT');
    expect(formatDateTime('2026-12-12T03:00:00Z', 'UTC')).toBe('Saturday, December 12, 2026 at 3:00 AM UTC');
  });

  it('has a short form for lists and a dated form for history', () => {
    expect(formatShortDateTime('2026-12-12T03:00:00Z', LA)).toBe('Fri, Dec 11, 7:00 PM PST');
    expect(meetingLabel({ startsAt: '2026-12-12T03:00:00Z', place: 'Ferncombe Village Hall' }, LA)).toBe('Fri, Dec 11, 7:00 PM PST — Ferncombe Village Hall');
    expect(formatTimestamp('2026-12-02T18:24:00Z', LA)).toBe('December 2, 2026 at 10:24 AM PST');
  });

  it('gives back text that is not a date as it came', () => {
    expect(formatDateTime('not a date', LA)).toBe('not a date');
    expect(formatCompactTimestamp('not a date', LA)).toBe('not a date');
  });

  it('has a compact form for table cells and a time of day, both in the guild’s zone with the zone named', () => {
    // 18:24 UTC on 2 December is 10:24 AM in Los Angeles (UTC−8 in winter) and 7:24 AM on the 3rd in Auckland
    // (UTC+13 in the southern summer) — IANA tz database.
    expect(formatCompactTimestamp('2026-12-02T18:24:00Z', LA)).toBe('Dec 2, 2026, 10:24 AM PST');
    expect(formatCompactTimestamp('2026-12-02T18:24:00Z', 'Pacific/Auckland')).toBe('Dec 3, 2026, 7:24 AM GMT+13');
    expect(formatTimeOfDay('2026-12-02T18:24:00Z', LA)).toBe('10:24 AM PST');
  });
});
