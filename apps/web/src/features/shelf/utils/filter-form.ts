import {
  formatMoney,
  formatWeight,
  MAX_BUNDLE_GRAMS,
  MAX_PRICE_MINOR,
  parseMoneyToMinor,
  shelfFiltersSchema,
  type ShelfFilters,
  type UnitSystem,
} from '@scrap-relay/shared';
import { z } from 'zod';
import { minorToMajorText } from '../../../utils/units.ts';
import { parseTypedWeight } from '../../../utils/weight-text.ts';

/**
 * The shelf's filter form: weights typed in the member's own units and a price in
 * the guild's currency, turned into the grams and minor units the API's shelf
 * filters schema takes (the form's schema ends by piping into that schema).
 */

export interface FilterFormValues {
  offer: string;
  cut: string;
  size: string;
  value: string;
  family: string;
  fibre: string;
  minWeight: string;
  maxWeight: string;
  maxPrice: string;
  q: string;
}

export interface FilterFormContext {
  units: UnitSystem;
  currency: string;
  /** The filters in force, so a weight shown rounded ("1 lb 2 oz" for 500 g) and sent back untouched keeps its exact grams. */
  current: ShelfFilters;
}

export const weightExample = (units: UnitSystem): string => (units === 'metric' ? 'e.g. 500 g or 1.5 kg' : 'e.g. 12 oz or 1 lb 4 oz');

export function filterFormValues(filters: ShelfFilters, { units, currency }: Omit<FilterFormContext, 'current'>): FilterFormValues {
  return {
    offer: filters.offer ?? '',
    cut: filters.cut ?? '',
    size: filters.size ?? '',
    value: filters.value ?? '',
    family: filters.family ?? '',
    fibre: filters.fibre ?? '',
    minWeight: filters.minGrams === undefined ? '' : formatWeight(filters.minGrams, units),
    maxWeight: filters.maxGrams === undefined ? '' : formatWeight(filters.maxGrams, units),
    maxPrice: filters.maxPriceMinor === undefined ? '' : minorToMajorText(filters.maxPriceMinor, currency),
    q: filters.q ?? '',
  };
}

const text = z.string();

export function filterFormSchema({ units, currency, current }: FilterFormContext): z.ZodType<ShelfFilters, FilterFormValues> {
  const heaviest = formatWeight(MAX_BUNDLE_GRAMS, units);
  return z
    .object({ offer: text, cut: text, size: text, value: text, family: text, fibre: text, minWeight: text, maxWeight: text, maxPrice: text, q: text })
    .transform((form, ctx) => {
      const grams = (field: 'minWeight' | 'maxWeight', kept: number | undefined): number | undefined => {
        const typed = form[field].trim();
        if (typed === '') return undefined;
        if (kept !== undefined && typed === formatWeight(kept, units)) return kept;
        const parsed = parseTypedWeight(typed, units);
        if (parsed === null) {
          ctx.addIssue({ code: 'custom', path: [field], message: `Enter a weight such as ${units === 'metric' ? '500 g' : '12 oz'}.` });
          return undefined;
        }
        if (parsed > MAX_BUNDLE_GRAMS) {
          ctx.addIssue({ code: 'custom', path: [field], message: `No bundle weighs more than ${heaviest}.` });
          return undefined;
        }
        return parsed;
      };
      const minGrams = grams('minWeight', current.minGrams);
      const maxGrams = grams('maxWeight', current.maxGrams);
      if (minGrams !== undefined && maxGrams !== undefined && minGrams > maxGrams) {
        ctx.addIssue({ code: 'custom', path: ['maxWeight'], message: 'The heaviest weight is less than the lightest.' });
      }

      let maxPriceMinor: number | undefined;
      const price = form.maxPrice.trim();
      if (price !== '') {
        const parsed = parseMoneyToMinor(price, currency);
        if (parsed === null) ctx.addIssue({ code: 'custom', path: ['maxPrice'], message: `Enter an amount such as ${minorToMajorText(1000, currency)}.` });
        else if (parsed > MAX_PRICE_MINOR) ctx.addIssue({ code: 'custom', path: ['maxPrice'], message: `No bundle costs more than ${formatMoney(MAX_PRICE_MINOR, currency)}.` });
        else maxPriceMinor = parsed;
      }

      const chosen = (value: string) => (value === '' ? undefined : value);
      // Menu choices are still plain strings here; the piped shelf filters schema checks them against the vocabularies.
      return {
        offer: chosen(form.offer),
        cut: chosen(form.cut),
        size: chosen(form.size),
        value: chosen(form.value),
        family: chosen(form.family),
        fibre: chosen(form.fibre),
        minGrams,
        maxGrams,
        maxPriceMinor,
        q: chosen(form.q.trim()),
      } as z.input<typeof shelfFiltersSchema>;
    })
    .pipe(shelfFiltersSchema) as z.ZodType<ShelfFilters, FilterFormValues>;
}
