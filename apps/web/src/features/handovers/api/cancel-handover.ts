import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { handoverSheetsQueryKey } from './get-handover-sheet.ts';

/** A handover that will not happen: a paid order is refunded, a starter bundle goes to the next new quilter. */
export const cancelHandover = ({ handoverId }: { handoverId: string }): Promise<void> =>
  api.post(`/handovers/${encodeURIComponent(handoverId)}/cancel`);

export function useCancelHandover(config: MutationConfig<{ handoverId: string }, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: cancelHandover,
    onSuccess: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: handoverSheetsQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
