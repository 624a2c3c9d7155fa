import type { ShelfFilters } from '../schemas/bundles.ts';
import type { UnitSystem } from '../schemas/members.ts';
import { COLOUR_FAMILY_LABELS, COLOUR_VALUE_LABELS, CUT_KIND_LABELS, CUT_SIZE_LABELS, FIBRE_LABELS } from './fibres.ts';
import { formatMoney, formatWeight } from './units.ts';

type ShelfOffer = NonNullable<ShelfFilters['offer']>;

const OFFER_WORDS: Readonly<Record<ShelfOffer, string>> = {
  sale: 'for sale',
  postage_only: 'free — postage only',
  meeting: 'free at a meeting',
};

/** Labels begin with a capital for headings; inside a sentence they read in lower case, except the proper noun in "English paper piecing". */
const inSentence = (label: string): string => (label.startsWith('English') ? label : label.charAt(0).toLowerCase() + label.slice(1));

export interface DescribeFiltersOptions {
  units: UnitSystem;
  /** Currency the price limit is in (the guild's). */
  currency: string;
}

/**
 * Filters in words, e.g. "Batik, dark, strips (by width), up to $10.00".
 * Empty filters read "Everything on the shelf".
 */
export function describeShelfFilters(filters: ShelfFilters, { units, currency }: DescribeFiltersOptions): string {
  const parts: string[] = [];
  if (filters.fibre) parts.push(FIBRE_LABELS[filters.fibre]);
  if (filters.value) parts.push(COLOUR_VALUE_LABELS[filters.value]);
  if (filters.family) parts.push(COLOUR_FAMILY_LABELS[filters.family]);
  if (filters.size) parts.push(CUT_SIZE_LABELS[filters.size]);
  else if (filters.cut) parts.push(CUT_KIND_LABELS[filters.cut]);
  if (filters.offer) parts.push(OFFER_WORDS[filters.offer]);
  const { minGrams, maxGrams } = filters;
  if (minGrams !== undefined && maxGrams !== undefined) parts.push(`${formatWeight(minGrams, units)} to ${formatWeight(maxGrams, units)}`);
  else if (minGrams !== undefined) parts.push(`at least ${formatWeight(minGrams, units)}`);
  else if (maxGrams !== undefined) parts.push(`up to ${formatWeight(maxGrams, units)}`);
  if (filters.maxPriceMinor !== undefined) parts.push(`costing up to ${formatMoney(filters.maxPriceMinor, currency)}`);
  if (filters.q) parts.push(`matching “${filters.q}”`);
  if (parts.length === 0) return 'Everything on the shelf';
  const sentence = parts.map(inSentence).join(', ');
  return sentence.charAt(0).toUpperCase() + sentence.slice(1);
}
