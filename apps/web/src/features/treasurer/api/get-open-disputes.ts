import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { treasurerQueryKey } from './get-ledger.ts';

/** Orders whose card payment a buyer's bank is disputing now, the nearest deadline for evidence first. */
export const getOpenDisputes = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: OrderView[] }> =>
  api.get('/orders', { query: { as: 'treasurer', disputes: 'open' }, signal });

export const getOpenDisputesQueryOptions = () =>
  queryOptions({
    queryKey: [...treasurerQueryKey, 'open-disputes'],
    queryFn: ({ signal }) => getOpenDisputes({ signal }),
  });

export const useOpenDisputes = () => useQuery(getOpenDisputesQueryOptions());
