// Types only from the shared schemas: their values would bring zod into the shelf's first load (see parseShelfFilters).
import {
  COLOUR_FAMILIES,
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUE_LABELS,
  COLOUR_VALUES,
  CUT_KIND_LABELS,
  CUT_KINDS,
  FIBRE_LABELS,
  FIBRES,
  formatMoney,
  formatWeight,
  type ShelfFilters,
  type ShelfQuery,
  type UnitSystem,
} from '@scrap-relay/shared';

/**
 * The shelf's filters as they travel: in the shelf's address (so a search can be
 * shared and the back button works), in a saved wish, and in words. Used by the
 * shelf and the wishes features alike.
 */

export type ShelfSort = ShelfQuery['sort'];

export interface ShelfSearch {
  filters: ShelfFilters;
  sort: ShelfSort;
  page: number;
}

/** Filter keys in the order they appear in an address and in words. */
export const SHELF_FILTER_KEYS = ['offer', 'cut', 'value', 'family', 'fibre', 'minGrams', 'maxGrams', 'maxPriceMinor', 'q'] as const satisfies readonly (keyof ShelfFilters)[];

const DEFAULT_SORT: ShelfSort = 'newest';

/**
 * The API's limits on filter numbers (MAX_BUNDLE_GRAMS and MAX_PRICE_MINOR in the shared schemas; a test
 * holds them equal).
 */
export const SHELF_FILTER_LIMITS = { grams: 50_000, priceMinor: 100_000 } as const;
const MAX_PAGE = 10_000;
const MAX_WORDS = 100;

type ShelfOffer = NonNullable<ShelfFilters['offer']>;

const OFFER_WORDS: Readonly<Record<ShelfOffer, string>> = {
  sale: 'for sale',
  postage_only: 'free — postage only',
  meeting: 'free at a meeting',
};

/** Each sort once; a record, so the compiler says when the API gains or loses one. */
const SORTS: Readonly<Record<ShelfSort, true>> = { newest: true, price_asc: true, price_desc: true, weight_asc: true, weight_desc: true };

const oneOf =
  <T extends string>(allowed: readonly T[]) =>
  (raw: unknown): T | undefined =>
    typeof raw === 'string' && (allowed as readonly string[]).includes(raw) ? (raw as T) : undefined;

/** As the API reads a number from a query string: whatever `Number()` makes of it, whole and within 0…max. */
const wholeNumber =
  (max: number, min = 0) =>
  (raw: unknown): number | undefined => {
    const n = Number(raw);
    return Number.isInteger(n) && n >= min && n <= max ? n : undefined;
  };

/**
 * Each filter read as the API's shelf schema reads it. Plain code rather than the schema itself: the zod
 * schemas are about 26 kB gzipped, and the shelf's first paint needs only these few checks. A test runs both
 * over the same values and expects the same answers.
 */
const FILTER_READERS: { [K in (typeof SHELF_FILTER_KEYS)[number]]-?: (raw: unknown) => ShelfFilters[K] } = {
  offer: (raw) => (typeof raw === 'string' && Object.hasOwn(OFFER_WORDS, raw) ? (raw as ShelfOffer) : undefined),
  cut: oneOf(CUT_KINDS),
  value: oneOf(COLOUR_VALUES),
  family: oneOf(COLOUR_FAMILIES),
  fibre: oneOf(FIBRES),
  minGrams: wholeNumber(SHELF_FILTER_LIMITS.grams),
  maxGrams: wholeNumber(SHELF_FILTER_LIMITS.grams),
  maxPriceMinor: wholeNumber(SHELF_FILTER_LIMITS.priceMinor),
  q: (raw) => {
    if (typeof raw !== 'string') return undefined;
    const words = raw.trim();
    return words.length <= MAX_WORDS ? words : undefined;
  },
};

/**
 * Filters from any key/value source (an address, a wish's stored filters). Each value
 * is checked on its own as the API would and dropped if refused, so an old or
 * hand-edited link still opens the shelf with whatever it says that is valid.
 */
export function parseShelfFilters(get: (key: string) => unknown): ShelfFilters {
  const filters: Record<string, unknown> = {};
  for (const key of SHELF_FILTER_KEYS) {
    const raw = get(key);
    if (raw === null || raw === undefined || raw === '') continue;
    const value = FILTER_READERS[key](raw);
    if (value !== undefined && value !== '') filters[key] = value;
  }
  return filters as ShelfFilters;
}

export function readShelfSearch(params: URLSearchParams): ShelfSearch {
  const sort = params.get('sort');
  const page = params.get('page');
  return {
    filters: parseShelfFilters((key) => params.get(key)),
    sort: sort !== null && Object.hasOwn(SORTS, sort) ? (sort as ShelfSort) : DEFAULT_SORT,
    page: (page !== null && wholeNumber(MAX_PAGE, 1)(page)) || 1,
  };
}

/** The address query for a search; defaults (newest first, page 1) are left out so links stay short. */
export function shelfSearchParams({ filters, sort = DEFAULT_SORT, page = 1 }: Partial<ShelfSearch> & { filters: ShelfFilters }): URLSearchParams {
  const params = new URLSearchParams();
  for (const key of SHELF_FILTER_KEYS) {
    const value = filters[key];
    if (value !== undefined && value !== '') params.set(key, String(value));
  }
  if (sort !== DEFAULT_SORT) params.set('sort', sort);
  if (page > 1) params.set('page', String(page));
  return params;
}

/** Only the keys that hold something, as the API stores a wish. */
export function compactFilters(filters: ShelfFilters): ShelfFilters {
  return Object.fromEntries(Object.entries(filters).filter(([, value]) => value !== undefined && value !== '')) as ShelfFilters;
}

export const countFilters = (filters: ShelfFilters): number => Object.keys(compactFilters(filters)).length;


/** Labels begin with a capital for headings; inside a sentence they read in lower case, except the proper noun in "English paper piecing". */
const inSentence = (label: string): string => (label.startsWith('English') ? label : label.charAt(0).toLowerCase() + label.slice(1));

export interface DescribeOptions {
  units: UnitSystem;
  /** Currency the price limit is in (the guild's). */
  currency: string;
}

/**
 * Filters in words, e.g. "Batik, dark, strips (by width), up to $10.00".
 * Empty filters read "Everything on the shelf".
 */
export function describeShelfFilters(filters: ShelfFilters, { units, currency }: DescribeOptions): string {
  const parts: string[] = [];
  if (filters.fibre) parts.push(FIBRE_LABELS[filters.fibre]);
  if (filters.value) parts.push(COLOUR_VALUE_LABELS[filters.value]);
  if (filters.family) parts.push(COLOUR_FAMILY_LABELS[filters.family]);
  if (filters.cut) parts.push(CUT_KIND_LABELS[filters.cut]);
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
