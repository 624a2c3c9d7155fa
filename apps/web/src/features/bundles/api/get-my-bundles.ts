import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { bundlesQueryKey } from './get-bundle.ts';

export const myBundlesQueryKey = [...bundlesQueryKey, 'mine'] as const;

/** The member's own bundles in every state, most recently changed first. */
export const getMyBundles = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: BundleView[] }> =>
  api.get('/bundles/mine', { signal });

export const getMyBundlesQueryOptions = () =>
  queryOptions({ queryKey: myBundlesQueryKey, queryFn: ({ signal }) => getMyBundles({ signal }) });

export const useMyBundles = () => useQuery(getMyBundlesQueryOptions());
