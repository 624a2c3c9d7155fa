import { useMutation } from '@tanstack/react-query';
import type { OrderView, orderCancelSchema } from '@scrap-relay/shared';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { useOrderChanged } from './order-cache.ts';

export interface CancelOrderVariables {
  orderId: string;
  data: z.output<typeof orderCancelSchema>;
}

/** Either side, before posting: a paid order is refunded in full, and its bundles go back on the shelf. */
export const cancelOrder = ({ orderId, data }: CancelOrderVariables): Promise<{ order: OrderView }> =>
  api.post(`/orders/${encodeURIComponent(orderId)}/cancel`, data);

export function useCancelOrder(config: MutationConfig<CancelOrderVariables, { order: OrderView }> = {}) {
  const changed = useOrderChanged();
  return useMutation({
    ...config,
    mutationFn: cancelOrder,
    onSuccess: async (...args) => {
      await changed(args[0].order);
      await config.onSuccess?.(...args);
    },
  });
}
