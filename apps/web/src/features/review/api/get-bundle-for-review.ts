import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const bundleForReviewQueryKey = (bundleId: string) => ['review', 'bundle', bundleId] as const;

/** One bundle as the librarian sees it (librarians may open bundles waiting for review). */
export const getBundleForReview = (bundleId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ bundle: BundleView }> =>
  api.get(`/bundles/${encodeURIComponent(bundleId)}`, { signal });

export const getBundleForReviewQueryOptions = (bundleId: string) =>
  queryOptions({ queryKey: bundleForReviewQueryKey(bundleId), queryFn: ({ signal }) => getBundleForReview(bundleId, { signal }) });

export const useBundleForReview = (bundleId: string) => useQuery(getBundleForReviewQueryOptions(bundleId));
