import { queryOptions } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const basketBundleQueryKey = (bundleId: string) => ['checkout', 'bundle', bundleId] as const;

/** One bundle as the shelf shows it now: the basket re-checks each of its bundles with this. */
export const getBundle = (bundleId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ bundle: BundleView }> =>
  api.get(`/bundles/${encodeURIComponent(bundleId)}`, { signal });

export const getBundleQueryOptions = (bundleId: string) =>
  queryOptions({ queryKey: basketBundleQueryKey(bundleId), queryFn: ({ signal }) => getBundle(bundleId, { signal }) });
