import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionUser } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { sessionQueryKey } from './get-session.ts';

export const verifyEmail = ({ token }: { token: string }): Promise<{ user: SessionUser }> =>
  api.post('/email-verifications', { token });

export function useVerifyEmail(config: MutationConfig<{ token: string }, { user: SessionUser }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: verifyEmail,
    onSuccess: async (...args) => {
      // The link may be opened signed in on this device: refresh so "e-mail not confirmed" goes away.
      await queryClient.invalidateQueries({ queryKey: sessionQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
