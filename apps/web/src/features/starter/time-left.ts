const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * Time left before a deadline in words, to the two largest units: "2 days and 5 hours",
 * "3 hours and 20 minutes", "45 minutes". Null once the deadline has passed.
 */
export function timeLeftText(deadline: string, now: Date = new Date()): string | null {
  const minutes = Math.floor((new Date(deadline).getTime() - now.getTime()) / 60_000);
  if (!(minutes > 0)) return null;
  const days = Math.floor(minutes / 1440);
  const hours = Math.floor((minutes % 1440) / 60);
  const rest = minutes % 60;
  const parts =
    days > 0
      ? [count(days, 'day', 'days'), hours > 0 ? count(hours, 'hour', 'hours') : null]
      : hours > 0
        ? [count(hours, 'hour', 'hours'), rest > 0 ? count(rest, 'minute', 'minutes') : null]
        : [count(rest, 'minute', 'minutes')];
  return parts.filter(Boolean).join(' and ');
}
