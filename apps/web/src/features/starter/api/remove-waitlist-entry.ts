import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { waitlistRemovalSchema } from '@scrap-relay/shared';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { deleteWithBody } from './delete-with-body.ts';
import { waitlistQueryKey } from './get-waitlist.ts';

export interface RemoveWaitlistEntryVariables {
  entryId: string;
  data: z.output<typeof waitlistRemovalSchema>;
}

/** DELETE with a body: the reason is kept on the entry for the guild's records. */
export const removeWaitlistEntry = ({ entryId, data }: RemoveWaitlistEntryVariables): Promise<void> =>
  deleteWithBody(`/waitlist/${encodeURIComponent(entryId)}`, data);

export function useRemoveWaitlistEntry(config: MutationConfig<RemoveWaitlistEntryVariables, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: removeWaitlistEntry,
    onSettled: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: waitlistQueryKey });
      await config.onSettled?.(...args);
    },
  });
}
