import type { Role } from '@scrap-relay/shared';

const dateFormat = new Intl.DateTimeFormat('en', { day: 'numeric', month: 'long', year: 'numeric' });

export function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateFormat.format(date);
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
