import { useEffect, useState } from 'react';
import { useOrder } from '../api/get-order.ts';

/** Where the buyer stands after coming back from the payment page. */
export type PaymentWait = 'confirming' | 'slow' | 'confirmed';

const POLL_MS = 1_500;
const SLOW_POLL_MS = 5_000;
// Webhooks usually land within a second or two; past this the page says it is taking longer than usual.
const SLOW_AFTER_MS = 20_000;

/**
 * The order, polled while a payment just made is being confirmed (`?paid=` in the
 * address, put there by the payment page's return link), and how that wait stands.
 */
export function useOrderAfterPayment(orderId: string, paidSession: string | null) {
  const [slow, setSlow] = useState(false);
  useEffect(() => {
    if (!paidSession) return;
    const timer = setTimeout(() => setSlow(true), SLOW_AFTER_MS);
    return () => clearTimeout(timer);
  }, [paidSession]);

  const query = useOrder(orderId, { pollWhileUnpaidMs: paidSession ? (slow ? SLOW_POLL_MS : POLL_MS) : null });
  const order = query.data?.order;
  let payment: PaymentWait | null = null;
  if (paidSession && order) {
    if (order.state === 'awaiting_payment') payment = slow ? 'slow' : 'confirming';
    else if (order.paidAt && order.viewerIs === 'buyer') payment = 'confirmed';
  }
  return { query, payment };
}
