import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const bundlesQueryKey = ['bundles'] as const;
export const bundleQueryKey = (id: string) => [...bundlesQueryKey, 'detail', id] as const;

/** One bundle as the signed-in member may see it; others' hidden bundles answer 404. */
export const getBundle = (id: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ bundle: BundleView }> =>
  api.get(`/bundles/${encodeURIComponent(id)}`, { signal });

export const getBundleQueryOptions = (id: string) =>
  queryOptions({ queryKey: bundleQueryKey(id), queryFn: ({ signal }) => getBundle(id, { signal }) });

export const useBundle = (id: string) => useQuery(getBundleQueryOptions(id));

/**
 * Every write answers with the whole bundle: keep it as the bundle's cached copy
 * and let lists (my bundles) read again.
 */
export function storeBundle(queryClient: QueryClient, bundle: BundleView): void {
  queryClient.setQueryData(bundleQueryKey(bundle.id), { bundle });
  void queryClient.invalidateQueries({ queryKey: bundlesQueryKey, predicate: (query) => query.queryKey[1] !== 'detail' });
}
