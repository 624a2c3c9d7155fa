import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { inviteCodeQueryKey } from './get-invite-code.ts';

/** Replaces the invite code; the old one stops working at once. */
export const rotateInviteCode = (): Promise<{ inviteCode: string }> => api.post('/guild/invite-code/rotate');

export function useRotateInviteCode(config: MutationConfig<void, { inviteCode: string }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: rotateInviteCode,
    onSuccess: async (...args) => {
      queryClient.setQueryData(inviteCodeQueryKey, args[0]);
      await config.onSuccess?.(...args);
    },
  });
}
