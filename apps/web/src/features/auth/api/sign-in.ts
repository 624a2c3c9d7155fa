import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionResponse, SessionUser, SignInInput } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { sessionQueryKey } from './get-session.ts';

export const signIn = (input: SignInInput): Promise<{ user: SessionUser }> => api.post('/session', input);

export function useSignIn(config: MutationConfig<SignInInput, { user: SessionUser }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: signIn,
    onSuccess: async (...args) => {
      const [{ user }] = args;
      // Everything cached belonged to the signed-out visitor; start clean for this member.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionQueryKey[0] });
      queryClient.setQueryData<SessionResponse>(sessionQueryKey, (old) => (old ? { ...old, user } : old));
      // Signing in issues a new CSRF token; read the session again to pick it up.
      await queryClient.invalidateQueries({ queryKey: sessionQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
