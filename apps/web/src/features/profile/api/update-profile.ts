import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProfileUpdateInput } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import type { Profile } from '../types.ts';
import { profileQueryKey } from './get-profile.ts';

export const updateProfile = (data: ProfileUpdateInput): Promise<{ profile: Profile }> => api.patch('/me', data);

export function useUpdateProfile(config: MutationConfig<ProfileUpdateInput, { profile: Profile }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updateProfile,
    onSuccess: async (...args) => {
      queryClient.setQueryData(profileQueryKey, { profile: args[0].profile });
      await config.onSuccess?.(...args);
    },
  });
}
