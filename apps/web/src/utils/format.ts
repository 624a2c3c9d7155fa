import type { Role } from '@scrap-relay/shared';

const dateFormats = new Map<string, Intl.DateTimeFormat>();

function dateFormatIn(timeZone: string): Intl.DateTimeFormat {
  let format = dateFormats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en', { day: 'numeric', month: 'long', year: 'numeric', timeZone });
    dateFormats.set(timeZone, format);
  }
  return format;
}

/**
 * "November 30, 2026": the day an instant falls on in `timeZone` (the guild's, `useGuildTimeZone()`), never the
 * device's. An order placed at 11 PM in the guild's evening is dated that evening wherever it is read.
 */
export function formatDate(iso: string, timeZone: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateFormatIn(timeZone).format(date);
}

const CALENDAR_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * "November 30, 2026" for a calendar date with no time ("2026-11-30", as date inputs and period filters give it).
 * Such a date names a day, not an instant, so no zone can move it to the day before or after.
 */
export function formatCalendarDate(day: string): string {
  const match = CALENDAR_DAY.exec(day);
  if (!match) return day;
  const [, year, month, date] = match.map(Number) as [number, number, number, number];
  const instant = new Date(Date.UTC(year, month - 1, date));
  return instant.getUTCDate() === date ? dateFormatIn('UTC').format(instant) : day;
}

export const ROLE_LABELS: Record<Role, string> = {
  member: 'Member',
  librarian: 'Librarian',
  treasurer: 'Treasurer',
  admin: 'Admin',
};

/** "Member, Librarian and Admin" — roles in the guild's order, not the order they were granted. */
export function formatRoles(roles: readonly Role[], order: readonly Role[]): string {
  const labels = order.filter((role) => roles.includes(role)).map((role) => ROLE_LABELS[role]);
  if (labels.length <= 1) return labels.join('');
  return `${labels.slice(0, -1).join(', ')} and ${labels.at(-1)}`;
}
