import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReviewQueueRow } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

export const reviewQueueQueryKey = ['review-queue'] as const;

/** Every bundle waiting for review, oldest first; the table sorts, filters and pages them in the browser. */
export const getReviewQueue = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: ReviewQueueRow[] }> =>
  api.get('/review-queue', { signal });

export const getReviewQueueQueryOptions = () =>
  queryOptions({ queryKey: reviewQueueQueryKey, queryFn: ({ signal }) => getReviewQueue({ signal }) });

export const useReviewQueue = () => useQuery(getReviewQueueQueryOptions());
