import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WishView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const wishesQueryKey = ['wishes'] as const;

/** The member's own wishes, newest first. */
export const getWishes = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: WishView[] }> => api.get('/wishes', { signal });

export const getWishesQueryOptions = () => queryOptions({ queryKey: wishesQueryKey, queryFn: ({ signal }) => getWishes({ signal }) });

export const useWishes = () => useQuery(getWishesQueryOptions());
