import { useMutation } from '@tanstack/react-query';
import type { OrderView, orderPostedSchema } from '@scrap-relay/shared';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { useOrderChanged } from './order-cache.ts';

export interface MarkPostedVariables {
  orderId: string;
  data: z.output<typeof orderPostedSchema>;
}

/** The seller: the parcel is on its way (a tracking number is optional). The buyer is e-mailed. */
export const markPosted = ({ orderId, data }: MarkPostedVariables): Promise<{ order: OrderView }> =>
  api.post(`/orders/${encodeURIComponent(orderId)}/posted`, data);

export function useMarkPosted(config: MutationConfig<MarkPostedVariables, { order: OrderView }> = {}) {
  const changed = useOrderChanged();
  return useMutation({
    ...config,
    mutationFn: markPosted,
    onSuccess: async (...args) => {
      await changed(args[0].order);
      await config.onSuccess?.(...args);
    },
  });
}
