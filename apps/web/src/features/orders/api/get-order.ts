import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { ordersQueryKey } from './get-orders.ts';

export const orderQueryKey = (orderId: string) => [...ordersQueryKey, 'detail', orderId] as const;

export const getOrder = (orderId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ order: OrderView }> =>
  api.get(`/orders/${encodeURIComponent(orderId)}`, { signal });

export const getOrderQueryOptions = (orderId: string) =>
  queryOptions({ queryKey: orderQueryKey(orderId), queryFn: ({ signal }) => getOrder(orderId, { signal }) });

/**
 * With `pollWhileUnpaidMs`, re-reads the order until it is no longer awaiting payment: after
 * the payment page the confirmation arrives by webhook, which may take a moment.
 */
export const useOrder = (orderId: string, { pollWhileUnpaidMs }: { pollWhileUnpaidMs?: number | null } = {}) =>
  useQuery({
    ...getOrderQueryOptions(orderId),
    refetchInterval: (query) => (pollWhileUnpaidMs && query.state.data?.order.state === 'awaiting_payment' ? pollWhileUnpaidMs : false),
  });
