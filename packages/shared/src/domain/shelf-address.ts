import type { ShelfFilters, ShelfQuery } from '../schemas/bundles.ts';
import { COLOUR_FAMILIES, COLOUR_VALUES, CUT_KINDS, CUT_SIZES, FIBRES } from './fibres.ts';

/**
 * The shelf's filters as they travel: in the shelf's address (so a search can be
 * shared and the back button works), in a saved wish, and in the request for a page
 * of bundles. Used by the web app's shelf and wishes, by its early start of the shelf
 * (apps/web/src/app/first-page.ts), and by the API, which names that first request
 * in the shelf page's headers so the browser asks for it at once. Kept small and free
 * of zod and of formatting code (the filters in words are `describeShelfFilters`).
 */

export type ShelfSort = ShelfQuery['sort'];

export interface ShelfSearch {
  filters: ShelfFilters;
  sort: ShelfSort;
  page: number;
}

/** Filter keys in the order they appear in an address and in words. */
export const SHELF_FILTER_KEYS = ['offer', 'cut', 'size', 'value', 'family', 'fibre', 'minGrams', 'maxGrams', 'maxPriceMinor', 'q'] as const satisfies readonly (keyof ShelfFilters)[];

const DEFAULT_SORT: ShelfSort = 'newest';

/**
 * The API's limits on filter numbers (MAX_BUNDLE_GRAMS and MAX_PRICE_MINOR in the shared schemas; a test
 * holds them equal).
 */
export const SHELF_FILTER_LIMITS = { grams: 50_000, priceMinor: 100_000 } as const;
const MAX_PAGE = 10_000;
const MAX_WORDS = 100;

type ShelfOffer = NonNullable<ShelfFilters['offer']>;

/** Each offer once; a record, so the compiler says when the API gains or loses one. */
const OFFERS: Readonly<Record<ShelfOffer, true>> = { sale: true, postage_only: true, meeting: true };

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
  offer: (raw) => (typeof raw === 'string' && Object.hasOwn(OFFERS, raw) ? (raw as ShelfOffer) : undefined),
  cut: oneOf(CUT_KINDS),
  size: oneOf(CUT_SIZES),
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

/** Bundles on one page of the shelf. */
export const SHELF_PAGE_SIZE = 24;

/** What the shelf asks the API for a search read from its address. */
export const shelfQueryFor = ({ filters, sort, page }: ShelfSearch): ShelfQuery => ({ ...filters, sort, page, pageSize: SHELF_PAGE_SIZE });

export type QueryValue = string | number | boolean | null | undefined;

/**
 * A request's query string, `?`-prefixed, or '' when nothing is set; empty values are left out. The web app's
 * API client builds every address with it, and the API names the shelf's first request with it, so the two
 * addresses are the same to the byte and the browser's early copy is the one the page uses.
 */
export function queryString(query: Readonly<Record<string, QueryValue>>): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const search = params.toString();
  return search ? `?${search}` : '';
}

/** The API address (below `/api`) of the page of bundles a shelf address shows, e.g. `/bundles?sort=newest&page=1&pageSize=24`. */
export const shelfPagePath = (address: URLSearchParams): string => `/bundles${queryString({ ...shelfQueryFor(readShelfSearch(address)) })}`;
