import { describe, expect, it } from 'vitest';
import { MAX_BUNDLE_GRAMS, MAX_PRICE_MINOR, shelfFiltersSchema, shelfQuerySchema } from '../schemas/bundles.ts';
import {
  countFilters,
  parseShelfFilters,
  readShelfSearch,
  SHELF_FILTER_KEYS,
  SHELF_FILTER_LIMITS,
  SHELF_PAGE_SIZE,
  shelfPagePath,
  shelfSearchParams,
  queryString,
} from './shelf-address.ts';

describe('the shelf search in the address', () => {
  it('reads filters, sort and page from the query string', () => {
    const search = readShelfSearch(new URLSearchParams('fibre=batik&value=dark&minGrams=200&maxPriceMinor=1000&q=reds&sort=price_asc&page=2'));
    expect(search).toEqual({
      filters: { fibre: 'batik', value: 'dark', minGrams: 200, maxPriceMinor: 1000, q: 'reds' },
      sort: 'price_asc',
      page: 2,
    });
  });

  it('drops what the API would refuse instead of failing the whole shelf', () => {
    const search = readShelfSearch(new URLSearchParams('fibre=spider_silk&cut=strips&minGrams=-3&maxGrams=heavy&sort=sideways&page=0&colour=red'));
    expect(search).toEqual({ filters: { cut: 'strips' }, sort: 'newest', page: 1 });
  });

  it('writes a short address: no defaults, filters in a fixed order', () => {
    expect(shelfSearchParams({ filters: {} }).toString()).toBe('');
    expect(shelfSearchParams({ filters: { q: 'reds', fibre: 'batik' }, sort: 'newest', page: 1 }).toString()).toBe('fibre=batik&q=reds');
    expect(shelfSearchParams({ filters: { cut: 'selvages' }, sort: 'weight_desc', page: 3 }).toString()).toBe('cut=selvages&sort=weight_desc&page=3');
  });

  it('comes back the same after a round trip', () => {
    const search = { filters: { offer: 'meeting' as const, family: 'warm' as const, maxGrams: 907 }, sort: 'price_desc' as const, page: 4 };
    expect(readShelfSearch(shelfSearchParams(search))).toEqual(search);
  });

  it('reads a saved wish, whose numbers are stored as numbers', () => {
    const wish: Record<string, string | number> = { fibre: 'flannel', minGrams: 454, maxPriceMinor: 0 };
    expect(parseShelfFilters((key) => wish[key])).toEqual({ fibre: 'flannel', minGrams: 454, maxPriceMinor: 0 });
    expect(countFilters(parseShelfFilters((key) => wish[key]))).toBe(3);
  });
});

describe('reading filters without the schemas, as the API reads them', () => {
  it('has the API’s limits', () => {
    expect(SHELF_FILTER_LIMITS).toEqual({ grams: MAX_BUNDLE_GRAMS, priceMinor: MAX_PRICE_MINOR });
  });

  // Values an address or a stored wish may hold, valid or not; each key's answer must be the schema's.
  const samples: unknown[] = [
    'sale', 'postage_only', 'meeting', 'starter', 'strips', 'fat_quarters', 'dark', 'warm', 'black_white', 'batik',
    'flannel', 'spider_silk', 'Sale', ' sale', '0', '1', '454', ' 454 ', '4.5', '-3', '1e3', '0x10', '50000', '50001',
    '100000', '100001', 'heavy', '   ', 'reds', '  reds  ', 'x'.repeat(100), `${'x'.repeat(100)} `, 'x'.repeat(101),
    454, 0, -1, 2.5, 100_001, true, ['5'], {},
  ];

  it.each(SHELF_FILTER_KEYS)('reads %s as the shelf schema does', (key) => {
    for (const raw of samples) {
      const parsed = shelfFiltersSchema.shape[key].safeParse(raw);
      const expected = parsed.success && parsed.data !== undefined && parsed.data !== '' ? { [key]: parsed.data } : {};
      expect(parseShelfFilters((k) => (k === key ? raw : undefined)), `${key} = ${JSON.stringify(raw)}`).toEqual(expected);
    }
  });

  it('reads sort and page as the shelf schema does', () => {
    const sorts = [null, '', 'newest', 'price_asc', 'price_desc', 'weight_asc', 'weight_desc', 'sideways', 'NEWEST'];
    for (const sort of sorts) {
      const parsed = shelfQuerySchema.shape.sort.safeParse(sort ?? undefined);
      const params = new URLSearchParams(sort === null ? '' : `sort=${sort}`);
      expect(readShelfSearch(params).sort, `sort=${sort}`).toBe(parsed.success ? parsed.data : 'newest');
    }
    const pages = [null, '', '0', '1', '2', ' 3 ', '2.5', '-1', '10000', '10001', 'two', '1e2'];
    for (const page of pages) {
      const parsed = shelfQuerySchema.shape.page.safeParse(page ?? undefined);
      const params = new URLSearchParams(page === null ? '' : `page=${encodeURIComponent(page)}`);
      expect(readShelfSearch(params).page, `page=${page}`).toBe(parsed.success ? parsed.data : 1);
    }
  });
});

describe('the request for a page of the shelf', () => {
  it('builds a query string from set values only, in the order given', () => {
    expect(queryString({ b: 'two words', a: 1, c: undefined, d: null, e: '', f: false })).toBe('?b=two+words&a=1&f=false');
    expect(queryString({ a: undefined })).toBe('');
  });

  it('asks for the first page, newest first, for a bare shelf address', () => {
    expect(shelfPagePath(new URLSearchParams(''))).toBe(`/bundles?sort=newest&page=1&pageSize=${SHELF_PAGE_SIZE}`);
  });

  it('carries the filters the address holds and drops what the API would refuse', () => {
    expect(shelfPagePath(new URLSearchParams('q=reds&fibre=batik&sort=price_asc&page=3&colour=plaid&maxGrams=-5'))).toBe(
      `/bundles?fibre=batik&q=reds&sort=price_asc&page=3&pageSize=${SHELF_PAGE_SIZE}`,
    );
  });

  it('is a request the shelf schema of the API accepts as it stands', () => {
    const path = shelfPagePath(new URLSearchParams('offer=sale&cut=strips&value=dark&minGrams=100&maxPriceMinor=900&sort=weight_desc&page=2'));
    const query = Object.fromEntries(new URLSearchParams(path.slice(path.indexOf('?') + 1)));
    expect(shelfQuerySchema.safeParse(query).success).toBe(true);
  });
});
