import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WishView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { wishesQueryKey } from './get-wishes.ts';

export const deleteWish = (wishId: string): Promise<void> => api.delete(`/wishes/${encodeURIComponent(wishId)}`);

export function useDeleteWish(config: MutationConfig<string, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: deleteWish,
    onSuccess: async (...args) => {
      const [, wishId] = args;
      // Gone on the server: drop it here at once rather than wait for the list to reload.
      queryClient.setQueryData<{ items: WishView[] }>(wishesQueryKey, (old) => (old ? { items: old.items.filter((wish) => wish.id !== wishId) } : old));
      await config.onSuccess?.(...args);
    },
  });
}
