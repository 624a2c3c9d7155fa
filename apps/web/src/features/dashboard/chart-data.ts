import {
  COLOUR_VALUE_LABELS,
  COLOUR_VALUES,
  CUT_KIND_LABELS,
  GRAMS_PER_POUND,
  OFFERS,
  type CutKind,
  type DashboardFigures,
  type Offer,
  type UnitSystem,
} from '@scrap-relay/shared';
import { formatShortMonth, guildMonthOf } from './period.ts';

type Charts = DashboardFigures['charts'];

/** The twelve months of the guild's calendar (its time zone, as the API groups them) ending with the month `now` falls in, oldest first. */
export function lastTwelveMonths(now: Date, timeZone = 'UTC'): string[] {
  const [year, month] = guildMonthOf(now, timeZone).split('-').map(Number) as [number, number];
  const months: string[] = [];
  for (let back = 11; back >= 0; back--) {
    months.push(new Date(Date.UTC(year, month - 1 - back, 1)).toISOString().slice(0, 7));
  }
  return months;
}

export interface WeightMonth {
  month: string;
  label: string;
  grams: Record<Offer, number>;
  totalGrams: number;
}

/** Weight rehomed per month and offer, every month present (a quiet month is a zero, not a gap). */
export function weightByMonth(rows: Charts['weightByMonth'], now: Date, timeZone = 'UTC'): WeightMonth[] {
  return lastTwelveMonths(now, timeZone).map((month) => {
    const grams = Object.fromEntries(OFFERS.map((offer) => [offer, 0])) as Record<Offer, number>;
    for (const row of rows) {
      if (row.month === month && (OFFERS as readonly string[]).includes(row.offer)) grams[row.offer as Offer] += row.grams;
    }
    return { month, label: formatShortMonth(month), grams, totalGrams: OFFERS.reduce((sum, offer) => sum + grams[offer], 0) };
  });
}

/** The unit a chart axis counts weight in: kilograms or pounds (the exact pound, NIST SP 811). */
export const chartWeightUnit = (units: UnitSystem): { label: string; perUnitGrams: number } =>
  units === 'metric' ? { label: 'kg', perUnitGrams: 1000 } : { label: 'lb', perUnitGrams: GRAMS_PER_POUND };

/** Grams as the axis unit to two decimals (bar heights only; tables show formatted weights). */
export const gramsInChartUnit = (grams: number, units: UnitSystem): number => Math.round((grams / chartWeightUnit(units).perUnitGrams) * 100) / 100;

export interface CountRow {
  key: string;
  label: string;
  bundles: number;
}

const VALUE_ORDER = [...COLOUR_VALUES, 'unknown'] as const;

/** Bundles on the shelf by colour value, light to dark then mixed and not given. */
export function shelfByValue(rows: Charts['shelfByValue']): CountRow[] {
  return VALUE_ORDER.map((value) => ({
    key: value,
    label: value === 'unknown' ? 'Not given' : COLOUR_VALUE_LABELS[value],
    bundles: rows.find((row) => row.value === value)?.bundles ?? 0,
  })).filter((row) => row.bundles > 0);
}

/** Bundles on the shelf by cut kind, most first (a bundle with several kinds counts in each). */
export function shelfByCut(rows: Charts['shelfByCut']): CountRow[] {
  return rows
    .map((row) => ({ key: row.cut, label: CUT_KIND_LABELS[row.cut as CutKind] ?? row.cut, bundles: row.bundles }))
    .sort((a, b) => b.bundles - a.bundles || a.label.localeCompare(b.label));
}

export interface ReviewMonth {
  month: string;
  label: string;
  /** Null in a month with no review decisions: the line breaks there instead of dropping to zero. */
  medianHours: number | null;
}

export function reviewTrend(rows: Charts['reviewHoursByMonth'], now: Date, timeZone = 'UTC'): ReviewMonth[] {
  return lastTwelveMonths(now, timeZone).map((month) => ({
    month,
    label: formatShortMonth(month),
    medianHours: rows.find((row) => row.month === month)?.medianHours ?? null,
  }));
}

/** "40 minutes", "5.5 hours", "2.3 days" — review times read best in the unit that suits them. */
export function formatHours(hours: number): string {
  if (hours < 1) return `${Math.round(hours * 60)} minutes`;
  if (hours < 48) return `${Math.round(hours * 10) / 10} hours`;
  return `${Math.round((hours / 24) * 10) / 10} days`;
}
