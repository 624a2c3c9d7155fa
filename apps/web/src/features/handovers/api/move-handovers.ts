import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { handoverMoveSchema } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { handoverSheetsQueryKey } from './get-handover-sheet.ts';

export interface MoveHandoversVariables {
  meetingId: string;
  data: z.output<typeof handoverMoveSchema>;
}

/** Moves everything not handed over to another (coming) meeting; both people are e-mailed. */
export const moveHandovers = ({ meetingId, data }: MoveHandoversVariables): Promise<{ moved: number }> =>
  api.post(`/meetings/${encodeURIComponent(meetingId)}/handovers/move`, data);

export function useMoveHandovers(config: MutationConfig<MoveHandoversVariables, { moved: number }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: moveHandovers,
    onSuccess: async (...args) => {
      // Both sheets change: this one loses them, the other gains them.
      await queryClient.invalidateQueries({ queryKey: handoverSheetsQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
