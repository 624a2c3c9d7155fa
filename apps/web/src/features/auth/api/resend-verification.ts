import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';

/** Sends a fresh confirmation link to the signed-in member's address (202, no body). */
export const resendVerification = (): Promise<void> => api.post('/email-verifications/resend');

export const useResendVerification = (config: MutationConfig<void, void> = {}) =>
  useMutation({ ...config, mutationFn: resendVerification });
