import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BundleView, ReviewDecisionInput } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { bundleForReviewQueryKey } from './get-bundle-for-review.ts';
import { reviewQueueQueryKey } from './get-review-queue.ts';

export interface DecideReviewVariables {
  bundleId: string;
  data: ReviewDecisionInput;
}

/** Approve (onto the shelf, matching wishes are e-mailed) or return with notes (the seller is e-mailed). */
export const decideReview = ({ bundleId, data }: DecideReviewVariables): Promise<{ bundle: BundleView | null }> =>
  api.post(`/bundles/${encodeURIComponent(bundleId)}/review`, data);

export function useDecideReview(config: MutationConfig<DecideReviewVariables, { bundle: BundleView | null }> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: decideReview,
    onSuccess: async (...args) => {
      const [, { bundleId }] = args;
      queryClient.removeQueries({ queryKey: bundleForReviewQueryKey(bundleId) });
      // The queue loses the bundle, and an approved one is now on the shelf.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewQueueQueryKey }),
        queryClient.invalidateQueries({ queryKey: ['shelf'] }),
      ]);
      await config.onSuccess?.(...args);
    },
  });
}
