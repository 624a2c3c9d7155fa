import { describe, expect, it } from 'vitest';
import { timeLeftText } from './time-left.ts';

describe('time left to answer an offer', () => {
  const now = new Date('2026-03-01T12:00:00Z');
  const after = (minutes: number) => new Date(now.getTime() + minutes * 60_000).toISOString();

  it('gives the two largest units, in words', () => {
    expect(timeLeftText(after(2 * 1440 + 5 * 60 + 7), now)).toBe('2 days and 5 hours');
    expect(timeLeftText(after(1440), now)).toBe('1 day');
    expect(timeLeftText(after(3 * 60 + 20), now)).toBe('3 hours and 20 minutes');
    expect(timeLeftText(after(60), now)).toBe('1 hour');
    expect(timeLeftText(after(1), now)).toBe('1 minute');
  });

  it('says nothing is left once the deadline has passed', () => {
    expect(timeLeftText(after(0), now)).toBeNull();
    expect(timeLeftText(after(-30), now)).toBeNull();
    expect(timeLeftText('not a date', now)).toBeNull();
  });
});
