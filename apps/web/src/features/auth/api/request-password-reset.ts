import { useMutation } from '@tanstack/react-query';
import type { passwordResetRequestSchema } from '@scrap-relay/shared';
import type { z } from 'zod';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';

export type PasswordResetRequestInput = z.output<typeof passwordResetRequestSchema>;

/** Always answers 202, whether or not the address has an account, so nobody can probe for members. */
export const requestPasswordReset = (input: PasswordResetRequestInput): Promise<void> => api.post('/password-resets', input);

export const useRequestPasswordReset = (config: MutationConfig<PasswordResetRequestInput, void> = {}) =>
  useMutation({ ...config, mutationFn: requestPasswordReset });
