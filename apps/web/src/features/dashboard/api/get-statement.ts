import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MonthStatement } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

/** The month-end statement straight from the ledger (month as YYYY-MM of the guild’s calendar, in its time zone). */
export const getStatement = (month: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ statement: MonthStatement }> =>
  api.get('/reports/statement', { query: { month }, signal });

export const getStatementQueryOptions = (month: string) =>
  queryOptions({ queryKey: ['statement', month], queryFn: ({ signal }) => getStatement(month, { signal }) });

export const useStatement = (month: string) => useQuery(getStatementQueryOptions(month));
