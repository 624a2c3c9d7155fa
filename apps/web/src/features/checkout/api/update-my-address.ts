import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PostalAddress } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { myAddressQueryKey } from '../../../lib/my-address.ts';

export const updateMyAddress = (address: PostalAddress): Promise<{ address: PostalAddress }> => api.put('/me/address', address);

export function useUpdateMyAddress(config: MutationConfig<PostalAddress, { address: PostalAddress }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updateMyAddress,
    onSuccess: async (...args) => {
      queryClient.setQueryData(myAddressQueryKey, { address: args[0].address });
      await config.onSuccess?.(...args);
    },
  });
}
