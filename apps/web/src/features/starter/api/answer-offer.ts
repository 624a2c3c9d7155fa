import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { starterClaimSchema } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import type { StarterClaimResult } from '../types.ts';
import { starterQueryKey } from './get-starter-bundles.ts';

export interface AcceptOfferVariables {
  offerId: string;
  data: z.input<typeof starterClaimSchema>;
}

export const acceptOffer = ({ offerId, data }: AcceptOfferVariables): Promise<StarterClaimResult> =>
  api.post(`/waitlist/offers/${encodeURIComponent(offerId)}/accept`, data);

/** Passing an offer on sends the bundle to the next person waiting. */
export const declineOffer = ({ offerId }: { offerId: string }): Promise<void> =>
  api.post(`/waitlist/offers/${encodeURIComponent(offerId)}/decline`);

export function useAcceptOffer(config: MutationConfig<AcceptOfferVariables, StarterClaimResult> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: acceptOffer,
    onSettled: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: starterQueryKey });
      await config.onSettled?.(...args);
    },
  });
}

export function useDeclineOffer(config: MutationConfig<{ offerId: string }, void> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: declineOffer,
    onSettled: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: starterQueryKey });
      await config.onSettled?.(...args);
    },
  });
}
