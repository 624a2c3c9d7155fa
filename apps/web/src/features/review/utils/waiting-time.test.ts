import { describe, expect, it } from 'vitest';
import { formatWaitingTime } from './waiting-time.ts';

const now = new Date('2026-03-10T12:00:00Z');
const before = (ms: number) => new Date(now.getTime() - ms).toISOString();
const HOUR = 3_600_000;

describe('how long a bundle has waited for review', () => {
  it('counts hours on the first day and whole days after', () => {
    expect(formatWaitingTime(before(10 * 60_000), now)).toBe('under an hour');
    expect(formatWaitingTime(before(HOUR), now)).toBe('1 hour');
    expect(formatWaitingTime(before(23.9 * HOUR), now)).toBe('23 hours');
    expect(formatWaitingTime(before(24 * HOUR), now)).toBe('1 day');
    expect(formatWaitingTime(before(75 * HOUR), now)).toBe('3 days');
  });

  it('reads a clock a little behind the server’s as just now', () => {
    expect(formatWaitingTime(before(-30_000), now)).toBe('under an hour');
  });
});
