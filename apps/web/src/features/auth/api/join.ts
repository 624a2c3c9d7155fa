import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { JoinInput, SessionResponse, SessionUser } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { sessionQueryKey } from './get-session.ts';

/** Creates the account with the guild's invite code; the new member is signed in, e-mail not yet confirmed. */
export const join = (input: JoinInput): Promise<{ user: SessionUser }> => api.post('/members', input);

export function useJoin(config: MutationConfig<JoinInput, { user: SessionUser }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: join,
    onSuccess: async (...args) => {
      const [{ user }] = args;
      queryClient.setQueryData<SessionResponse>(sessionQueryKey, (old) => (old ? { ...old, user } : old));
      // Joining signs the member in, which issues a new CSRF token.
      await queryClient.invalidateQueries({ queryKey: sessionQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
