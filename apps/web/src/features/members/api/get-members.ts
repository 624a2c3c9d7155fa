import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MemberRow } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const membersQueryKey = ['members'] as const;

/** Every member of the guild; the admin table sorts, filters and pages them in the browser. */
export const getMembers = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: MemberRow[] }> =>
  api.get('/members', { signal });

export const getMembersQueryOptions = () =>
  queryOptions({ queryKey: membersQueryKey, queryFn: ({ signal }) => getMembers({ signal }) });

export const useMembers = () => useQuery(getMembersQueryOptions());
