import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ShelfPage, ShelfQuery } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const shelfQueryKey = ['shelf'] as const;

/** One page of bundles on the shelf; the API filters, sorts and pages. */
export const getShelf = (query: ShelfQuery, { signal }: { signal?: AbortSignal } = {}): Promise<ShelfPage> =>
  api.get('/bundles', { query: { ...query }, signal });

export const getShelfQueryOptions = (query: ShelfQuery) =>
  queryOptions({
    queryKey: [...shelfQueryKey, query],
    queryFn: ({ signal }) => getShelf(query, { signal }),
    // Keep the last page on screen while the next filter or page loads, instead of flashing "loading".
    placeholderData: keepPreviousData,
  });

export const useShelf = (query: ShelfQuery) => useQuery(getShelfQueryOptions(query));
