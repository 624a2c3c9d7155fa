import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderView } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { ordersQueryKey } from './get-orders.ts';

export interface PackingSlip {
  order: OrderView;
  /** An SVG document of the QR code for the order reference, made by the API. */
  qrSvg: string;
}

/** For the seller of a paid order (and officers): the order with the buyer's address, and a QR code of its reference. */
export const getPackingSlip = (orderId: string, { signal }: { signal?: AbortSignal } = {}): Promise<PackingSlip> =>
  api.get(`/orders/${encodeURIComponent(orderId)}/packing-slip`, { signal });

export const getPackingSlipQueryOptions = (orderId: string) =>
  queryOptions({ queryKey: [...ordersQueryKey, 'packing-slip', orderId], queryFn: ({ signal }) => getPackingSlip(orderId, { signal }) });

export const usePackingSlip = (orderId: string) => useQuery(getPackingSlipQueryOptions(orderId));
