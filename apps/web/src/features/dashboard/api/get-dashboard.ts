import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DashboardFigures, DashboardQuery } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

/** What the exchange has done in the period; money figures come only for officers who see the ledger. */
export const getDashboard = (query: DashboardQuery, { signal }: { signal?: AbortSignal } = {}): Promise<{ figures: DashboardFigures }> =>
  api.get('/dashboard', { query: { period: query.period, from: query.from, to: query.to }, signal });

export const getDashboardQueryOptions = (query: DashboardQuery) =>
  queryOptions({
    queryKey: ['dashboard', query.period, query.from ?? null, query.to ?? null],
    queryFn: ({ signal }) => getDashboard(query, { signal }),
    // Keep the last figures on screen while another period loads, instead of flashing "Loading".
    placeholderData: keepPreviousData,
  });

export const useDashboard = (query: DashboardQuery) => useQuery(getDashboardQueryOptions(query));
