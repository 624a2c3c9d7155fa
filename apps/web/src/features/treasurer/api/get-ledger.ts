import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LedgerEntryView, LedgerQuery } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const treasurerQueryKey = ['treasurer'] as const;

/** Ledger entries, newest first, filtered by date (inclusive, the guild's dates) and kind. */
export const getLedger = (query: LedgerQuery, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: LedgerEntryView[] }> =>
  api.get('/ledger', { query: { ...query }, signal });

export const getLedgerQueryOptions = (query: LedgerQuery) =>
  queryOptions({
    queryKey: [...treasurerQueryKey, 'ledger', query.from ?? '', query.to ?? '', query.kind ?? ''],
    queryFn: ({ signal }) => getLedger(query, { signal }),
    placeholderData: keepPreviousData,
  });

export const useLedger = (query: LedgerQuery) => useQuery(getLedgerQueryOptions(query));

/** The same entries as a CSV download for the guild's books; a plain link, so the browser saves the file. */
export function ledgerCsvHref(query: LedgerQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  const search = params.toString();
  return search ? `/api/ledger.csv?${search}` : '/api/ledger.csv';
}
