import { meetingSchema } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import { isoToLocalInput, localInputToIso, meetingHasStarted, toIsoWithOffset } from './meetings.ts';

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

describe('datetime-local input ↔ instant (browser time zone)', () => {
  it('reads the typed wall-clock time in the browser’s zone and shows it back unchanged', () => {
    const iso = localInputToIso('2026-12-10T19:00');
    expect(iso).not.toBeNull();
    expect(new Date(iso!).getTime()).toBe(new Date(2026, 11, 10, 19, 0).getTime());
    expect(isoToLocalInput(iso!)).toBe('2026-12-10T19:00');
  });

  it('refuses an incomplete or impossible date instead of guessing', () => {
    expect(localInputToIso('')).toBeNull();
    expect(localInputToIso('2026-12-10')).toBeNull();
    expect(localInputToIso('2026-02-31T19:00')).toBeNull();
    expect(isoToLocalInput('not a date')).toBe('');
  });

  it('counts a meeting as started from its start time on', () => {
    const meeting = { startsAt: '2026-12-10T19:00:00Z' };
    expect(meetingHasStarted(meeting, new Date('2026-12-10T18:59:00Z'))).toBe(false);
    expect(meetingHasStarted(meeting, new Date('2026-12-10T19:00:00Z'))).toBe(true);
  });
});
