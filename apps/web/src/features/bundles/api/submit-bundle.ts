import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { storeBundle } from './get-bundle.ts';

/**
 * Sends a draft, a returned bundle, or a withdrawn or expired one (relisting) to
 * the librarian. An incomplete listing answers 422 with the missing fields.
 */
export const submitBundle = (bundleId: string): Promise<{ bundle: BundleView }> =>
  api.post(`/bundles/${encodeURIComponent(bundleId)}/submit`);

export function useSubmitBundle(config: MutationConfig<string, { bundle: BundleView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: submitBundle,
    onSuccess: async (...args) => {
      storeBundle(queryClient, args[0].bundle);
      await config.onSuccess?.(...args);
    },
  });
}
