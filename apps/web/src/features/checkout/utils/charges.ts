import { allowsFulfilment } from '@scrap-relay/shared';
import type { BasketLine } from './basket-lines.ts';

/**
 * What the "Before you pay" notes are about, from what is in the basket: a card payment happens only for a
 * price or for postage, and an address goes to a seller only for a parcel. A free bundle collected at a
 * meeting involves neither.
 */
export interface BasketCharges {
  /** Some bundle has a price, or can go by post (postage is paid by card). */
  mayCharge: boolean;
  /** Some bundle can go by post, so the buyer's address may be sent to its seller. */
  mayPost: boolean;
}

export function basketCharges(lines: readonly BasketLine[]): BasketCharges {
  const mayPost = lines.some((line) => allowsFulfilment(line.bundle, 'post'));
  const priced = lines.some((line) => line.bundle.offer === 'sale' && (line.bundle.priceMinor ?? 0) > 0);
  return { mayCharge: priced || mayPost, mayPost };
}
