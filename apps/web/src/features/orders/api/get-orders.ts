import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export type OrderSide = 'buyer' | 'seller';

export const ordersQueryKey = ['orders'] as const;

/** The member's own orders, newest first: those they bought, or those they gave or sold. */
export const getOrders = (as: OrderSide, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: OrderView[] }> =>
  api.get('/orders', { query: { as }, signal });

export const getOrdersQueryOptions = (as: OrderSide) =>
  queryOptions({ queryKey: [...ordersQueryKey, 'list', as], queryFn: ({ signal }) => getOrders(as, { signal }) });

export const useOrders = (as: OrderSide) => useQuery(getOrdersQueryOptions(as));
