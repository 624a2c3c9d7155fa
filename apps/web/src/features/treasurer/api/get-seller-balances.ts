import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SellerBalanceView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { treasurerQueryKey } from './get-ledger.ts';

export const sellerBalancesQueryKey = [...treasurerQueryKey, 'seller-balances'] as const;

/** What the guild owes each seller: credits (net of refunds) less payouts, split into payable now and waiting for bags to go out. */
export const getSellerBalances = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: SellerBalanceView[] }> =>
  api.get('/seller-balances', { signal });

export const getSellerBalancesQueryOptions = () =>
  queryOptions({ queryKey: sellerBalancesQueryKey, queryFn: ({ signal }) => getSellerBalances({ signal }) });

export const useSellerBalances = () => useQuery(getSellerBalancesQueryOptions());
