import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { passwordResetCompleteSchema } from '@scrap-relay/shared';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { sessionQueryKey } from './get-session.ts';

export type PasswordResetCompleteInput = z.output<typeof passwordResetCompleteSchema>;

export const completePasswordReset = (input: PasswordResetCompleteInput): Promise<void> =>
  api.post('/password-resets/complete', input);

export function useCompletePasswordReset(config: MutationConfig<PasswordResetCompleteInput, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: completePasswordReset,
    onSuccess: async (...args) => {
      // A new password may end other sessions, this one included.
      await queryClient.invalidateQueries({ queryKey: sessionQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
