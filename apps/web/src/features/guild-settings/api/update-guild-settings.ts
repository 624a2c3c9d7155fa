import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GuildSettings } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { guildSettingsQueryKey } from './get-guild-settings.ts';

/** Replaces the whole settings document (PUT), as validated by `guildSettingsSchema`. */
export const updateGuildSettings = (settings: GuildSettings): Promise<{ settings: GuildSettings }> =>
  api.put('/guild/settings', settings);

export function useUpdateGuildSettings(config: MutationConfig<GuildSettings, { settings: GuildSettings }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: updateGuildSettings,
    onSuccess: async (...args) => {
      queryClient.setQueryData(guildSettingsQueryKey, args[0]);
      await config.onSuccess?.(...args);
    },
  });
}
