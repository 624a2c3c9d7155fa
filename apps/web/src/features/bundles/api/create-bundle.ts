import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleDraftInput, BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { storeBundle } from './get-bundle.ts';

/** Starts a draft with whatever the form holds so far. */
export const createBundle = (data: BundleDraftInput): Promise<{ bundle: BundleView }> => api.post('/bundles', data);

export function useCreateBundle(config: MutationConfig<BundleDraftInput, { bundle: BundleView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: createBundle,
    onSuccess: async (...args) => {
      storeBundle(queryClient, args[0].bundle);
      await config.onSuccess?.(...args);
    },
  });
}
