import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { storeBundle } from './get-bundle.ts';

export interface DeletePhotoVariables {
  bundleId: string;
  photoId: string;
}

export const deletePhoto = ({ bundleId, photoId }: DeletePhotoVariables): Promise<{ bundle: BundleView }> =>
  api.delete(`/bundles/${encodeURIComponent(bundleId)}/photos/${encodeURIComponent(photoId)}`);

export function useDeletePhoto(config: MutationConfig<DeletePhotoVariables, { bundle: BundleView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: deletePhoto,
    onSuccess: async (...args) => {
      storeBundle(queryClient, args[0].bundle);
      await config.onSuccess?.(...args);
    },
  });
}
