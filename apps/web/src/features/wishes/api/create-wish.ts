import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WishInput, WishView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { wishesQueryKey } from './get-wishes.ts';

export const createWish = (input: WishInput): Promise<{ wish: WishView }> => api.post('/wishes', input);

export function useCreateWish(config: MutationConfig<WishInput, { wish: WishView }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: createWish,
    onSuccess: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: wishesQueryKey });
      await config.onSuccess?.(...args);
    },
  });
}
