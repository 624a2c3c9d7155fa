import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { starterQueryKey } from './get-starter-bundles.ts';

/** The member takes themselves off the queue; an open offer of theirs passes to the next person. */
export const leaveWaitlist = (): Promise<void> => api.delete('/waitlist/me');

export function useLeaveWaitlist(config: MutationConfig<void, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: leaveWaitlist,
    onSettled: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: starterQueryKey });
      await config.onSettled?.(...args);
    },
  });
}
