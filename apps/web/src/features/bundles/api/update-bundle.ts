import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleDraftInput, BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { storeBundle } from './get-bundle.ts';

export interface UpdateBundleVariables {
  bundleId: string;
  data: BundleDraftInput;
}

/** Saves the draft as it stands; the API merges it with what is stored and checks the result. */
export const updateBundle = ({ bundleId, data }: UpdateBundleVariables): Promise<{ bundle: BundleView }> =>
  api.patch(`/bundles/${encodeURIComponent(bundleId)}`, data);

export function useUpdateBundle(config: MutationConfig<UpdateBundleVariables, { bundle: BundleView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updateBundle,
    onSuccess: async (...args) => {
      storeBundle(queryClient, args[0].bundle);
      await config.onSuccess?.(...args);
    },
  });
}
