import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { Profile } from '../types.ts';

export const profileQueryKey = ['profile'] as const;

export const getProfile = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ profile: Profile }> => api.get('/me', { signal });

export const getProfileQueryOptions = () => queryOptions({ queryKey: profileQueryKey, queryFn: ({ signal }) => getProfile({ signal }) });

export const useProfile = () => useQuery(getProfileQueryOptions());
