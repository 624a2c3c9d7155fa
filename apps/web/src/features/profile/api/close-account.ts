import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import type { closeAccountSchema } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';

export type CloseAccountInput = z.output<typeof closeAccountSchema>;

/** Closes the member's own account (password to confirm); the session ends with it. */
export const closeAccount = (data: CloseAccountInput): Promise<void> => api.post('/me/close', data);

export function useCloseAccount(config: MutationConfig<CloseAccountInput, void> = {}) {
  return useMutation({ ...config, mutationFn: closeAccount });
}
