import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OrderCreateInput, OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import type { MutationConfig } from '../../../lib/react-query.ts';
import { myAddressQueryKey } from '../../../lib/my-address.ts';

export interface PlacedOrder {
  order: OrderView;
  /** The payment page to send the buyer to; null when there is nothing to pay (a free meeting handover). */
  checkoutUrl: string | null;
}

/** Holds the bundles and opens the card payment; 409 when someone else took one first, 503 when the payment service is down (nothing held). */
export const placeOrder = (input: OrderCreateInput): Promise<PlacedOrder> => api.post('/orders', input);

export function usePlaceOrder(config: MutationConfig<OrderCreateInput, PlacedOrder> = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    ...config,
    mutationFn: placeOrder,
    onSuccess: async (...args) => {
      const [, input] = args;
      if (input.saveAddress) await queryClient.invalidateQueries({ queryKey: myAddressQueryKey });
      await queryClient.invalidateQueries({ queryKey: ['orders'] });
      await config.onSuccess?.(...args);
    },
  });
}
