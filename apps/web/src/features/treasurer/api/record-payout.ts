import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PayoutInput } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { treasurerQueryKey } from './get-ledger.ts';

export interface RecordedPayout {
  id: string;
  sellerId: string;
  amountMinor: number;
  currency: string;
  method: PayoutInput['method'];
  reference: string;
  createdAt: string;
}

/** Money the treasurer has paid a seller outside Scrap Relay (transfer, cheque, cash); 422 when it is more than what is payable now. */
export const recordPayout = (input: PayoutInput): Promise<{ payout: RecordedPayout }> => api.post('/payouts', input);

export function useRecordPayout(config: MutationConfig<PayoutInput, { payout: RecordedPayout }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: recordPayout,
    onSuccess: async (...args) => {
      // Balances and the ledger both change.
      await queryClient.invalidateQueries({ queryKey: treasurerQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
