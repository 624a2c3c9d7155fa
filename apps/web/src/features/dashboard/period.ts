import { dashboardQuerySchema, wallTimeAt, type DashboardQuery } from '@scrap-relay/shared';
import type { z } from 'zod';

export type Period = DashboardQuery['period'];

export const PERIOD_LABELS: Record<Period, string> = {
  month: 'This month',
  year: 'This year',
  all: 'All time',
  custom: 'Between two dates',
};

/**
 * The period in the page address (?period=custom&from=…&to=…), so a chosen view can be
 * bookmarked or sent; anything the API's schema refuses falls back to this month.
 */
export function periodFromSearch(search: URLSearchParams): DashboardQuery {
  const raw: z.input<typeof dashboardQuerySchema> = {};
  const period = search.get('period');
  if (period) raw.period = period as Period;
  const from = search.get('from');
  const to = search.get('to');
  if (from) raw.from = from;
  if (to) raw.to = to;
  const parsed = dashboardQuerySchema.safeParse(raw);
  return parsed.success ? parsed.data : { period: 'month' };
}

/** The query as address parameters; the same ones the API takes, so the CSV link matches the page. */
export function periodToSearch(query: DashboardQuery): URLSearchParams {
  const params = new URLSearchParams({ period: query.period });
  if (query.period === 'custom') {
    if (query.from) params.set('from', query.from);
    if (query.to) params.set('to', query.to);
  }
  return params;
}

export const csvHref = (path: '/api/dashboard.csv' | '/api/reports/statement.csv', params: URLSearchParams): string => `${path}?${params.toString()}`;

/** "2026-03" for the month a date falls in on the guild's calendar (its time zone), which the statement and dashboard count in. */
export function guildMonthOf(date: Date, timeZone: string): string {
  const { year, month } = wallTimeAt(date, timeZone);
  return `${year}-${String(month).padStart(2, '0')}`;
}

const monthFormat = new Intl.DateTimeFormat('en', { month: 'long', year: 'numeric', timeZone: 'UTC' });
const shortMonthFormat = new Intl.DateTimeFormat('en', { month: 'short', year: 'numeric', timeZone: 'UTC' });

/** "2026-03" → "March 2026". */
export const formatMonth = (month: string): string => monthFormat.format(new Date(`${month}-01T00:00:00Z`));
/** "2026-03" → "Mar 2026", for chart axes. */
export const formatShortMonth = (month: string): string => shortMonthFormat.format(new Date(`${month}-01T00:00:00Z`));
