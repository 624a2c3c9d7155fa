import { useMutation } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { useOrderChanged } from './order-cache.ts';

/** The treasurer: refund a paid order in full (for example after a reported problem). The buyer is e-mailed. */
export const refundOrder = (orderId: string): Promise<{ order: OrderView }> => api.post(`/orders/${encodeURIComponent(orderId)}/refund`);

export function useRefundOrder(config: MutationConfig<string, { order: OrderView }> = {}) {
  const changed = useOrderChanged();
  return useMutation({
    ...config,
    mutationFn: refundOrder,
    onSuccess: async (...args) => {
      await changed(args[0].order);
      await config.onSuccess?.(...args);
    },
  });
}
