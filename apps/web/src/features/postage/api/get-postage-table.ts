import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PostageTable } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const postageTableQueryKey = ['guild', 'postage'] as const;

/** The guild's postage table (the default one until an admin saves their own). */
export const getPostageTable = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ postage: PostageTable }> =>
  api.get('/guild/postage', { signal });

export const getPostageTableQueryOptions = () =>
  queryOptions({ queryKey: postageTableQueryKey, queryFn: ({ signal }) => getPostageTable({ signal }) });

export const usePostageTable = () => useQuery(getPostageTableQueryOptions());
