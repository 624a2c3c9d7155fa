import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PostageTable, PostageTableInput } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { postageTableQueryKey } from './get-postage-table.ts';

/** Saves the whole table; 400 names the field that is wrong (`bands.3.zone`). Quotes use it from the next request. */
export const updatePostageTable = (table: PostageTableInput): Promise<{ postage: PostageTable }> => api.put('/guild/postage', table);

export function useUpdatePostageTable(config: MutationConfig<PostageTableInput, { postage: PostageTable }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updatePostageTable,
    onSuccess: async (...args) => {
      queryClient.setQueryData(postageTableQueryKey, { postage: args[0].postage });
      await config.onSuccess?.(...args);
    },
  });
}
