import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { StarterBundlesResponse } from '../types.ts';

export const starterQueryKey = ['starter-bundles'] as const;

/** The member's standing in the programme (eligibility, queue, offer, claims) and the starter bundles free now. */
export const getStarterBundles = ({ signal }: { signal?: AbortSignal } = {}): Promise<StarterBundlesResponse> =>
  api.get('/starter-bundles', { signal });

export const getStarterBundlesQueryOptions = () =>
  queryOptions({ queryKey: starterQueryKey, queryFn: ({ signal }) => getStarterBundles({ signal }) });

export const useStarterBundles = () => useQuery(getStarterBundlesQueryOptions());
