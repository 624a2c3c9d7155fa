import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DashboardQuery } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { LibrarianReport } from '../types.ts';

/** Review, starter-programme and handover activity for the period. */
export const getLibrarianReport = (query: DashboardQuery, { signal }: { signal?: AbortSignal } = {}): Promise<{ report: LibrarianReport }> =>
  api.get('/reports/librarian', { query: { period: query.period, from: query.from, to: query.to }, signal });

export const getLibrarianReportQueryOptions = (query: DashboardQuery) =>
  queryOptions({
    queryKey: ['librarian-report', query.period, query.from ?? null, query.to ?? null],
    queryFn: ({ signal }) => getLibrarianReport(query, { signal }),
    placeholderData: keepPreviousData,
  });

export const useLibrarianReport = (query: DashboardQuery) => useQuery(getLibrarianReportQueryOptions(query));
