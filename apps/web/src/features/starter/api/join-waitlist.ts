import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { starterQueryKey } from './get-starter-bundles.ts';

export interface JoinWaitlistResult {
  entry: { id: string; status: string; joinedAt: string };
}

export const joinWaitlist = (): Promise<JoinWaitlistResult> => api.post('/waitlist', {});

export function useJoinWaitlist(config: MutationConfig<void, JoinWaitlistResult> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: joinWaitlist,
    onSettled: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: starterQueryKey });
      await config.onSettled?.(...args);
    },
  });
}
