import { useQueryClient } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { orderQueryKey } from './get-order.ts';
import { ordersQueryKey } from './get-orders.ts';

/** After any change to an order: show the answer at once, and let the lists re-read. */
export function useOrderChanged() {
  const queryClient = useQueryClient();
  return async (order: OrderView) => {
    queryClient.setQueryData(orderQueryKey(order.id), { order });
    await queryClient.invalidateQueries({ queryKey: [...ordersQueryKey, 'list'] });
  };
}
