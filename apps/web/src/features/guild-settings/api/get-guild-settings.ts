import { queryOptions, useQuery } from '@tanstack/react-query';
import type { GuildSettings } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const guildSettingsQueryKey = ['guild', 'settings'] as const;

export const getGuildSettings = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ settings: GuildSettings }> =>
  api.get('/guild/settings', { signal });

export const getGuildSettingsQueryOptions = () =>
  queryOptions({ queryKey: guildSettingsQueryKey, queryFn: ({ signal }) => getGuildSettings({ signal }) });

export const useGuildSettings = () => useQuery(getGuildSettingsQueryOptions());
