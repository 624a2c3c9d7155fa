import { describe, expect, it } from 'vitest';
import {
  type WaitlistEntry,
  addMonthsUtc,
  isNewQuilter,
  nextInLine,
  offerExpiresAtFrom,
  offerLapsed,
  starterEligibility,
  waitlistOrder,
} from './claims.ts';

const at = (iso: string) => new Date(iso);
const DAY = 24 * 60 * 60 * 1000;

describe('isNewQuilter (PRODUCT.md: newcomer window, default 12 months, or the librarian flag)', () => {
  const joinedAt = at('2025-03-15T10:00:00Z');

  it('counts a member as new until the window ends, not at its end (design choice: half-open)', () => {
    const base = { joinedAt, newQuilterFlag: false, newcomerWindowMonths: 12 };
    expect(isNewQuilter({ ...base, now: at('2025-03-15T10:00:00Z') })).toBe(true);
    expect(isNewQuilter({ ...base, now: at('2026-03-15T09:59:59.999Z') })).toBe(true);
    expect(isNewQuilter({ ...base, now: at('2026-03-15T10:00:00Z') })).toBe(false);
  });

  it('keeps a flagged member new whatever their join date', () => {
    expect(isNewQuilter({ joinedAt: at('2019-01-01T00:00:00Z'), newQuilterFlag: true, newcomerWindowMonths: 12, now: at('2026-01-01T00:00:00Z') })).toBe(true);
  });

  it('adds calendar months, clamping to the end of short months', () => {
    expect(addMonthsUtc(at('2025-01-31T08:00:00Z'), 1).toISOString()).toBe('2025-02-28T08:00:00.000Z');
    expect(addMonthsUtc(at('2024-01-31T08:00:00Z'), 1).toISOString()).toBe('2024-02-29T08:00:00.000Z');
    expect(addMonthsUtc(at('2025-11-30T00:00:00Z'), 3).toISOString()).toBe('2026-02-28T00:00:00.000Z');
  });
});

describe('starterEligibility (PRODUCT.md default: one starter bundle per 90 days)', () => {
  const rules = { isNewQuilter: true, limitPerWindow: 1, windowDays: 90 };
  const claimed = at('2026-01-10T12:00:00Z');

  it('lets a new quilter with no claims claim', () => {
    expect(starterEligibility({ ...rules, claimsAt: [], now: claimed })).toEqual({ eligible: true });
  });

  it('refuses someone who is not a new quilter', () => {
    expect(starterEligibility({ ...rules, isNewQuilter: false, claimsAt: [], now: claimed })).toEqual({
      eligible: false,
      reason: 'not_new_quilter',
    });
  });

  it('refuses within the window and says when, and allows from the exact end (design choice: half-open)', () => {
    const end = new Date(claimed.getTime() + 90 * DAY);
    expect(starterEligibility({ ...rules, claimsAt: [claimed], now: new Date(end.getTime() - 1) })).toEqual({
      eligible: false,
      reason: 'over_limit',
      nextEligibleAt: end,
    });
    expect(starterEligibility({ ...rules, claimsAt: [claimed], now: end })).toEqual({ eligible: true });
  });

  it('with a limit of two, waits for the older of the counting claims to age out', () => {
    const first = at('2026-01-01T00:00:00Z');
    const second = at('2026-02-01T00:00:00Z');
    const old = at('2025-06-01T00:00:00Z');
    const result = starterEligibility({ ...rules, limitPerWindow: 2, claimsAt: [second, old, first], now: at('2026-03-01T00:00:00Z') });
    expect(result).toEqual({ eligible: false, reason: 'over_limit', nextEligibleAt: new Date(first.getTime() + 90 * DAY) });
    expect(starterEligibility({ ...rules, limitPerWindow: 2, claimsAt: [second, old], now: at('2026-03-01T00:00:00Z') })).toEqual({
      eligible: true,
    });
  });
});

describe('waitlist (PRODUCT.md: offers in the order members asked)', () => {
  const now = at('2026-04-01T18:00:00Z');
  const entry = (memberId: string, joined: string, status: WaitlistEntry['status'] = 'waiting', offerExpiresAt?: string): WaitlistEntry => ({
    memberId,
    joinedQueueAt: at(joined),
    status,
    offerExpiresAt: offerExpiresAt ? at(offerExpiresAt) : null,
  });

  it('offers to the longest-waiting member, ties by member id', () => {
    const entries = [
      entry('m-3', '2026-03-02T09:00:00Z'),
      entry('m-2', '2026-03-01T09:00:00Z'),
      entry('m-1', '2026-03-02T09:00:00Z'),
    ];
    expect(nextInLine(entries, now)?.memberId).toBe('m-2');
    expect(waitlistOrder(entries, now).map((e) => e.memberId)).toEqual(['m-2', 'm-1', 'm-3']);
  });

  it('passes to the next member after a decline', () => {
    const entries = [entry('m-1', '2026-03-01T09:00:00Z', 'declined'), entry('m-2', '2026-03-02T09:00:00Z')];
    expect(nextInLine(entries, now)?.memberId).toBe('m-2');
  });

  it('passes to the next member when an offer lapses, at its exact expiry', () => {
    const offered = entry('m-1', '2026-03-01T09:00:00Z', 'offered', '2026-04-01T18:00:00Z');
    expect(offerLapsed(offered, new Date(now.getTime() - 1))).toBe(false);
    expect(offerLapsed(offered, now)).toBe(true);
    const lapsed = { ...offered, status: 'lapsed' as const };
    expect(nextInLine([lapsed, entry('m-2', '2026-03-02T09:00:00Z')], now)?.memberId).toBe('m-2');
  });

  it('does not count a claimed or removed offer as lapsed', () => {
    expect(offerLapsed(entry('m-1', '2026-03-01T09:00:00Z', 'claimed', '2026-03-05T00:00:00Z'), now)).toBe(false);
    expect(offerLapsed(entry('m-1', '2026-03-01T09:00:00Z', 'offered'), now)).toBe(false);
  });

  it('skips members who cannot claim now and entries dated after now', () => {
    const entries = [
      entry('m-1', '2026-03-01T09:00:00Z'),
      entry('m-2', '2026-03-02T09:00:00Z'),
      entry('m-9', '2026-04-02T09:00:00Z'),
    ];
    expect(nextInLine(entries, now, (e) => e.memberId !== 'm-1')?.memberId).toBe('m-2');
    expect(nextInLine(entries, now, (e) => e.memberId === 'm-9')).toBeNull();
    expect(nextInLine([], now)).toBeNull();
  });

  it('sets the offer expiry from the guild setting in hours', () => {
    expect(offerExpiresAtFrom(now, 48).toISOString()).toBe('2026-04-03T18:00:00.000Z');
  });
});
