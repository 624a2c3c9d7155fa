import { describe, expect, it } from 'vitest';
import { formatWhen, meetingLabel } from './format.ts';

// Offsets from the IANA time zone database (Pacific Standard Time is UTC−8 in December; London keeps GMT in winter).
describe('times in e-mails', () => {
  const evening = new Date('2026-12-09T03:00:00Z');

  it('gives a meeting in the guild’s own zone, with the zone named', () => {
    expect(formatWhen(evening, 'America/Los_Angeles')).toBe('Tuesday, December 8, 2026 at 7:00 PM PST');
    expect(meetingLabel({ startsAt: evening, place: 'Ferncombe Hall' }, 'America/Los_Angeles')).toBe(
      'Tuesday, December 8, 2026 at 7:00 PM PST, Ferncombe Hall',
    );
  });

  it('names UTC and GMT as such for a guild that keeps them', () => {
    expect(formatWhen(evening, 'UTC')).toBe('Wednesday, December 9, 2026 at 3:00 AM UTC');
    expect(formatWhen(evening, 'Europe/London')).toBe('Wednesday, December 9, 2026 at 3:00 AM GMT');
  });
});
