import { useMutation } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { useOrderChanged } from './order-cache.ts';

/** The buyer: the parcel arrived. The seller is e-mailed. */
export const markReceived = (orderId: string): Promise<{ order: OrderView }> => api.post(`/orders/${encodeURIComponent(orderId)}/received`);

export function useMarkReceived(config: MutationConfig<string, { order: OrderView }> = {}) {
  const changed = useOrderChanged();
  return useMutation({
    ...config,
    mutationFn: markReceived,
    onSuccess: async (...args) => {
      await changed(args[0].order);
      await config.onSuccess?.(...args);
    },
  });
}
