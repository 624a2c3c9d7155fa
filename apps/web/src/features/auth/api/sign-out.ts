import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionResponse } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { sessionQueryKey } from './get-session.ts';

export const signOut = (): Promise<void> => api.delete('/session');

export function useSignOut(config: MutationConfig<void, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: signOut,
    onSuccess: async (...args) => {
      await config.onSuccess?.(...args);
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionQueryKey[0] });
      queryClient.setQueryData<SessionResponse>(sessionQueryKey, (old) => (old ? { ...old, user: null } : old));
      await queryClient.invalidateQueries({ queryKey: sessionQueryKey });
    },
  });
}
