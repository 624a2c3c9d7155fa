/**
 * Fair claims for starter bundles: who counts as a new quilter, how many starter bundles
 * they may claim, and the order of the waitlist. The clock is always passed in (`now`).
 *
 * Windows are half-open: a member is new from joinedAt up to (not including) the end of
 * the newcomer window; a claim counts against the limit for windowDays × 24 h after it is
 * made and stops counting at that exact instant; an offer lapses at its expiry instant.
 */

const MS_PER_DAY = 24 * 60 * 60 * 1000;
const MS_PER_HOUR = 60 * 60 * 1000;

/**
 * `date` plus whole calendar months in UTC, clamped to the last day of a short month
 * (31 Jan + 1 month → 28 or 29 Feb), time of day kept.
 */
export function addMonthsUtc(date: Date, months: number): Date {
  const target = new Date(date.getTime());
  const day = date.getUTCDate();
  target.setUTCDate(1);
  target.setUTCMonth(target.getUTCMonth() + months);
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(day, lastDay));
  return target;
}

export interface NewQuilterInput {
  joinedAt: Date;
  /** Set by the librarian; makes the member new whatever their join date. */
  newQuilterFlag: boolean;
  newcomerWindowMonths: number;
  now: Date;
}

/** New quilter: flagged by the librarian, or joined within the newcomer window. */
export function isNewQuilter({ joinedAt, newQuilterFlag, newcomerWindowMonths, now }: NewQuilterInput): boolean {
  if (newQuilterFlag) return true;
  return now.getTime() < addMonthsUtc(joinedAt, newcomerWindowMonths).getTime();
}

export interface StarterEligibilityInput {
  isNewQuilter: boolean;
  /** When this member claimed starter bundles (any order; older ones are ignored). */
  claimsAt: readonly Date[];
  limitPerWindow: number;
  windowDays: number;
  now: Date;
}

export type StarterEligibility =
  | { eligible: true }
  | { eligible: false; reason: 'not_new_quilter' }
  | { eligible: false; reason: 'over_limit'; nextEligibleAt: Date };

/** May this member claim a starter bundle now; if over the limit, from when. */
export function starterEligibility(input: StarterEligibilityInput): StarterEligibility {
  if (!Number.isInteger(input.limitPerWindow) || input.limitPerWindow < 1) throw new RangeError('The limit must be at least 1');
  if (!input.isNewQuilter) return { eligible: false, reason: 'not_new_quilter' };
  const windowMs = input.windowDays * MS_PER_DAY;
  const nowMs = input.now.getTime();
  const counting = input.claimsAt
    .map((d) => d.getTime())
    .filter((t) => t <= nowMs && nowMs < t + windowMs)
    .sort((a, b) => a - b);
  if (counting.length < input.limitPerWindow) return { eligible: true };
  // Enough of the oldest claims must age out to leave room for one more.
  const freeing = counting[counting.length - input.limitPerWindow];
  if (freeing === undefined) throw new Error('unreachable: at least limitPerWindow claims count');
  return { eligible: false, reason: 'over_limit', nextEligibleAt: new Date(freeing + windowMs) };
}

export const WAITLIST_STATUSES = ['waiting', 'offered', 'declined', 'lapsed', 'claimed', 'left', 'removed'] as const;
export type WaitlistStatus = (typeof WAITLIST_STATUSES)[number];

export interface WaitlistEntry {
  memberId: string;
  joinedQueueAt: Date;
  status: WaitlistStatus;
  offerExpiresAt?: Date | null;
}

/** An offer lapses when it is still open (status `offered`) at or after its expiry. */
export function offerLapsed(entry: WaitlistEntry, now: Date): boolean {
  return entry.status === 'offered' && entry.offerExpiresAt != null && now.getTime() >= entry.offerExpiresAt.getTime();
}

/** When an offer made now expires. */
export const offerExpiresAtFrom = (now: Date, offerHours: number): Date => new Date(now.getTime() + offerHours * MS_PER_HOUR);

/**
 * Waiting entries in queue order: by joinedQueueAt, ties by memberId. Only `waiting`
 * counts: an open, declined or lapsed offer has had its turn, and an entry dated after
 * `now` is not in the queue yet. `isEligible` drops members who cannot claim now (for
 * example over their limit); they keep their place for later.
 */
export function waitlistOrder<T extends WaitlistEntry>(
  entries: readonly T[],
  now: Date,
  isEligible: (entry: T, now: Date) => boolean = () => true,
): T[] {
  return entries
    .filter((e) => e.status === 'waiting' && e.joinedQueueAt.getTime() <= now.getTime() && isEligible(e, now))
    .sort((a, b) => a.joinedQueueAt.getTime() - b.joinedQueueAt.getTime() || compareIds(a.memberId, b.memberId));
}

/** The entry to offer the next starter bundle to, or null when nobody eligible is waiting. */
export function nextInLine<T extends WaitlistEntry>(
  entries: readonly T[],
  now: Date,
  isEligible?: (entry: T, now: Date) => boolean,
): T | null {
  return waitlistOrder(entries, now, isEligible)[0] ?? null;
}

const compareIds = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0);
