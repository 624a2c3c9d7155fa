import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PostalAddress } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

/** The signed-in member's own saved address: the "from" on a packing slip the seller prints. */
export const getSenderAddress = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ address: PostalAddress | null }> =>
  api.get('/me/address', { signal });

// Same key and shape as the checkout's copy of this endpoint, so the two share one cached answer.
export const getSenderAddressQueryOptions = () =>
  queryOptions({ queryKey: ['me', 'address'] as const, queryFn: ({ signal }) => getSenderAddress({ signal }) });

export const useSenderAddress = (enabled: boolean) => useQuery({ ...getSenderAddressQueryOptions(), enabled });
