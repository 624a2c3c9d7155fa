import type { Offer } from '@scrap-relay/shared';
import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { queueSearchParams, readQueueSearch, type QueueSearch, type QueueSortColumn } from '../utils/queue-search.ts';

/**
 * The queue's sort, filters and page live in the address, as the shelf's search does: each change is a new
 * history entry, so Back steps through earlier views and a reload keeps the one shown.
 */
export function useQueueSearch() {
  const [params, setParams] = useSearchParams();
  const search = useMemo(() => readQueueSearch(params), [params]);

  const go = useCallback(
    (next: QueueSearch, replace = false) => {
      const nextParams = queueSearchParams(next);
      // The same view again adds no step for the back button.
      if (nextParams.toString() !== queueSearchParams(search).toString()) setParams(nextParams, { replace });
    },
    [setParams, search],
  );

  return {
    search,
    /** A new sort or filter starts again at the first page. */
    setSort: useCallback((column: QueueSortColumn, desc: boolean) => go({ ...search, sort: { column, desc }, page: 1 }), [go, search]),
    setOffer: useCallback((offer: Offer | '') => go({ ...search, offer, page: 1 }), [go, search]),
    setSellerId: useCallback((sellerId: string) => go({ ...search, sellerId, page: 1 }), [go, search]),
    setPage: useCallback((page: number) => go({ ...search, page }), [go, search]),
    /** Back onto the last page when the one in the address has emptied: no step for the back button. */
    fixPage: useCallback((page: number) => go({ ...search, page }, true), [go, search]),
  };
}
