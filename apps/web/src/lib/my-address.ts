import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PostalAddress } from '@scrap-relay/shared';
import { api } from './api-client.ts';

/** Shared because checkout fills in its address form with it and the bundle page quotes postage to it. */
export const myAddressQueryKey = ['me', 'address'] as const;

/** The member's saved postal address, or null; only ever sent to the seller of a paid order. */
export const getMyAddress = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ address: PostalAddress | null }> =>
  api.get('/me/address', { signal });

export const getMyAddressQueryOptions = () =>
  queryOptions({ queryKey: myAddressQueryKey, queryFn: ({ signal }) => getMyAddress({ signal }) });

export const useMyAddress = () => useQuery(getMyAddressQueryOptions());
