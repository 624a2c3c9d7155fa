import { readShelfSearch, type ShelfFilters, type ShelfSearch, shelfSearchParams, type ShelfSort } from '@scrap-relay/shared';
import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';

/**
 * The shelf's search lives in the address: each change is a new history entry,
 * so the back button steps through earlier searches and a link shares one.
 */
export function useShelfSearch() {
  const [params, setParams] = useSearchParams();
  const search = useMemo(() => readShelfSearch(params), [params]);

  const go = useCallback(
    (next: ShelfSearch) => {
      const nextParams = shelfSearchParams(next);
      // Applying the same search again should not add a step for the back button.
      if (nextParams.toString() !== shelfSearchParams(search).toString()) setParams(nextParams);
    },
    [setParams, search],
  );

  return {
    search,
    /** New filters start again at the first page. */
    setFilters: useCallback((filters: ShelfFilters) => go({ ...search, filters, page: 1 }), [go, search]),
    setSort: useCallback((sort: ShelfSort) => go({ ...search, sort, page: 1 }), [go, search]),
    /** The address of another page of the same search, for links. */
    pageHref: useCallback((page: number) => `?${shelfSearchParams({ ...search, page }).toString()}`, [search]),
  };
}
