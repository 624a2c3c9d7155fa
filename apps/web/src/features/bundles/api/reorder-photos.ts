import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { storeBundle } from './get-bundle.ts';

export interface ReorderPhotosVariables {
  bundleId: string;
  /** Every photo of the bundle once, cover photo first. */
  photoIds: string[];
}

export const reorderPhotos = ({ bundleId, photoIds }: ReorderPhotosVariables): Promise<{ bundle: BundleView }> =>
  api.put(`/bundles/${encodeURIComponent(bundleId)}/photos/order`, { photoIds });

export function useReorderPhotos(config: MutationConfig<ReorderPhotosVariables, { bundle: BundleView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: reorderPhotos,
    onSuccess: async (...args) => {
      storeBundle(queryClient, args[0].bundle);
      await config.onSuccess?.(...args);
    },
  });
}
