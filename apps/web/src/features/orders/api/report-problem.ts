import { useMutation } from '@tanstack/react-query';
import type { OrderView, orderProblemSchema } from '@scrap-relay/shared';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { useOrderChanged } from './order-cache.ts';

export interface ReportProblemVariables {
  orderId: string;
  data: z.output<typeof orderProblemSchema>;
}

/** The buyer, once the parcel is posted: what went wrong. The treasurer sees it on the order and may refund. */
export const reportProblem = ({ orderId, data }: ReportProblemVariables): Promise<{ order: OrderView }> =>
  api.post(`/orders/${encodeURIComponent(orderId)}/problems`, data);

export function useReportProblem(config: MutationConfig<ReportProblemVariables, { order: OrderView }> = {}) {
  const changed = useOrderChanged();
  return useMutation({
    ...config,
    mutationFn: reportProblem,
    onSuccess: async (...args) => {
      await changed(args[0].order);
      await config.onSuccess?.(...args);
    },
  });
}
