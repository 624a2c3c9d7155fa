import { describe, expect, it } from 'vitest';
import { gramsInChartUnit, lastTwelveMonths, reviewTrend, shelfByCut, shelfByValue, weightByMonth, formatHours } from './chart-data.ts';
import { csvHref, guildMonthOf, periodFromSearch, periodToSearch } from './period.ts';

const now = new Date('2026-03-15T10:00:00Z');

describe('weight rehomed per month', () => {
  it('covers the twelve months up to this one, across a year end', () => {
    const months = lastTwelveMonths(now);
    expect(months).toHaveLength(12);
    expect(months[0]).toBe('2025-04');
    expect(months.at(-1)).toBe('2026-03');
  });

  it('counts months on the guild’s calendar: 07:30 UTC on 1 December is still November in Los Angeles (UTC−8 then, from memory)', () => {
    const lateNovember = new Date('2025-12-01T07:30:00Z');
    expect(lastTwelveMonths(lateNovember, 'America/Los_Angeles').at(-1)).toBe('2025-11');
    expect(lastTwelveMonths(lateNovember, 'UTC').at(-1)).toBe('2025-12');
    expect(guildMonthOf(lateNovember, 'America/Los_Angeles')).toBe('2025-11');
  });

  it('stacks by offer and fills quiet months with zeros', () => {
    const rows = weightByMonth(
      [
        { month: '2026-01', offer: 'sale', grams: 454 },
        { month: '2026-01', offer: 'starter', grams: 300 },
        { month: '2026-03', offer: 'meeting', grams: 250 },
        { month: '2024-01', offer: 'sale', grams: 999 },
      ],
      now,
    );
    const january = rows.find((r) => r.month === '2026-01')!;
    expect(january.grams).toEqual({ sale: 454, postage_only: 0, meeting: 0, starter: 300 });
    expect(january.totalGrams).toBe(754);
    expect(rows.find((r) => r.month === '2026-02')!.totalGrams).toBe(0);
    expect(rows.reduce((sum, r) => sum + r.totalGrams, 0)).toBe(1004);
  });

  it('draws bars in kilograms or exact pounds (1 lb = 453.59237 g, NIST SP 811)', () => {
    expect(gramsInChartUnit(1500, 'metric')).toBe(1.5);
    expect(gramsInChartUnit(907.18474, 'imperial')).toBe(2);
    expect(gramsInChartUnit(454, 'imperial')).toBe(1);
  });
});

describe('the shelf and review charts', () => {
  it('orders colour values light to dark, leaving out empty ones', () => {
    expect(shelfByValue([{ value: 'dark', bundles: 2 }, { value: 'unknown', bundles: 1 }, { value: 'light', bundles: 4 }])).toEqual([
      { key: 'light', label: 'Light', bundles: 4 },
      { key: 'dark', label: 'Dark', bundles: 2 },
      { key: 'unknown', label: 'Not given', bundles: 1 },
    ]);
  });

  it('names cut kinds as the listing form does, most common first', () => {
    expect(shelfByCut([{ cut: 'selvages', bundles: 1 }, { cut: 'strips', bundles: 3 }]).map((r) => r.label)).toEqual(['Strips (by width)', 'Selvages']);
  });

  it('leaves a gap in the review trend for a month without decisions', () => {
    const trend = reviewTrend([{ month: '2026-02', medianHours: 5.5 }], now);
    expect(trend.find((r) => r.month === '2026-02')!.medianHours).toBe(5.5);
    expect(trend.find((r) => r.month === '2026-01')!.medianHours).toBeNull();
  });

  it('words review times in the unit that suits them', () => {
    expect(formatHours(0.5)).toBe('30 minutes');
    expect(formatHours(5.54)).toBe('5.5 hours');
    expect(formatHours(60)).toBe('2.5 days');
  });
});

describe('the period in the address and the CSV link', () => {
  it('reads a valid period and keeps custom dates', () => {
    expect(periodFromSearch(new URLSearchParams('period=year'))).toEqual({ period: 'year' });
    expect(periodFromSearch(new URLSearchParams('period=custom&from=2026-01-01&to=2026-01-31'))).toEqual({ period: 'custom', from: '2026-01-01', to: '2026-01-31' });
  });

  it('falls back to this month for what the API would refuse', () => {
    expect(periodFromSearch(new URLSearchParams('period=custom&from=2026-02-01'))).toEqual({ period: 'month' });
    expect(periodFromSearch(new URLSearchParams('period=decade'))).toEqual({ period: 'month' });
    expect(periodFromSearch(new URLSearchParams(''))).toEqual({ period: 'month' });
  });

  it('gives the CSV the same query as the page', () => {
    const params = periodToSearch({ period: 'custom', from: '2026-01-01', to: '2026-01-31' });
    expect(csvHref('/api/dashboard.csv', params)).toBe('/api/dashboard.csv?period=custom&from=2026-01-01&to=2026-01-31');
    expect(periodToSearch({ period: 'all', from: '2026-01-01' }).toString()).toBe('period=all');
  });
});
