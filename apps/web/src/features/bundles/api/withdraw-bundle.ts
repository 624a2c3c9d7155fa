import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { storeBundle } from './get-bundle.ts';

/** Takes a bundle off the shelf (or out of review); it can be relisted later. */
export const withdrawBundle = (bundleId: string): Promise<{ bundle: BundleView }> =>
  api.post(`/bundles/${encodeURIComponent(bundleId)}/withdraw`);

export function useWithdrawBundle(config: MutationConfig<string, { bundle: BundleView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: withdrawBundle,
    onSuccess: async (...args) => {
      storeBundle(queryClient, args[0].bundle);
      await config.onSuccess?.(...args);
    },
  });
}
