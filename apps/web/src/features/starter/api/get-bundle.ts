import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BundleView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

/** One bundle in full (photos, contents, yield) — here, the starter bundle offered to the member. */
export const getBundle = (bundleId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ bundle: BundleView }> =>
  api.get(`/bundles/${encodeURIComponent(bundleId)}`, { signal });

export const getBundleQueryOptions = (bundleId: string) =>
  queryOptions({ queryKey: ['bundles', bundleId], queryFn: ({ signal }) => getBundle(bundleId, { signal }) });

export const useBundle = (bundleId: string | undefined) =>
  useQuery({ ...getBundleQueryOptions(bundleId ?? ''), enabled: Boolean(bundleId) });
