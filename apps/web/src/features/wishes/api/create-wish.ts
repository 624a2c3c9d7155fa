import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WishInput, WishView } from '@scrap-relay/shared';
import { api, isApiError } from '../../../lib/api-client.ts';
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
    onError: async (...args) => {
      // Refused as a twin of a wish saved elsewhere (another tab, another device): show that wish here too.
      if (isApiError(args[0]) && args[0].status === 409) await queryClient.invalidateQueries({ queryKey: wishesQueryKey });
      await config.onError?.(...args);
    },
  });
}
