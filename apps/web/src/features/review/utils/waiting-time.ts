const HOUR_MS = 60 * 60 * 1000;
const DAY_MS = 24 * HOUR_MS;

/**
 * How long a bundle has waited for review, in the coarse steps a volunteer plans by:
 * "under an hour", "5 hours", "3 days". A clock slightly behind the server's reads as "under an hour".
 */
export function formatWaitingTime(submittedAt: string, now: Date = new Date()): string {
  const waited = now.getTime() - new Date(submittedAt).getTime();
  if (!Number.isFinite(waited)) return '';
  if (waited < HOUR_MS) return 'under an hour';
  if (waited < DAY_MS) {
    const hours = Math.floor(waited / HOUR_MS);
    return hours === 1 ? '1 hour' : `${hours} hours`;
  }
  const days = Math.floor(waited / DAY_MS);
  return days === 1 ? '1 day' : `${days} days`;
}
