import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';

export const inviteCodeQueryKey = ['guild', 'invite-code'] as const;

export const getInviteCode = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ inviteCode: string }> =>
  api.get('/guild/invite-code', { signal });

export const getInviteCodeQueryOptions = () =>
  queryOptions({ queryKey: inviteCodeQueryKey, queryFn: ({ signal }) => getInviteCode({ signal }) });

export const useInviteCode = () => useQuery(getInviteCodeQueryOptions());
