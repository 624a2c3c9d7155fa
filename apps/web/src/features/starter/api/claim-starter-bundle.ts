import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { starterClaimSchema } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import type { StarterClaimResult } from '../types.ts';
import { starterQueryKey } from './get-starter-bundles.ts';

export interface ClaimStarterBundleVariables {
  bundleId: string;
  data: z.input<typeof starterClaimSchema>;
}

export const claimStarterBundle = ({ bundleId, data }: ClaimStarterBundleVariables): Promise<StarterClaimResult> =>
  api.post(`/starter-bundles/${encodeURIComponent(bundleId)}/claims`, data);

export function useClaimStarterBundle(config: MutationConfig<ClaimStarterBundleVariables, StarterClaimResult> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: claimStarterBundle,
    // Success and "someone else was quicker" both change what is free: read it again either way.
    onSettled: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: starterQueryKey });
      await config.onSettled?.(...args);
    },
  });
}
