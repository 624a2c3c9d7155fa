import type { BasketCharges } from '../utils/charges.ts';

/**
 * What a buyer should know before paying: who takes the money, whose rules apply, where the address goes.
 * Shown only when the basket can cost something; the address note only when something can go by post.
 */
export function MerchantNotes({ guildName, charges }: { guildName: string; charges: BasketCharges }) {
  if (!charges.mayCharge) return null;
  return (
    <aside aria-label="Before you pay" className="space-y-2 rounded-stitch border-2 border-seam bg-linen p-4">
      <h2 className="text-lg font-bold">Before you pay</h2>
      <ul className="list-disc space-y-1 pl-5">
        <li>
          <strong>{guildName} is the merchant.</strong> Card payments go to the guild’s account; the guild pays the seller their share
          and keeps its fee.
        </li>
        <li>Fees and refunds follow the guild’s own rules and local law.</li>
        {charges.mayPost ? <li>Your postal address goes only to the seller of a paid order, to post it to you. It is never shown on a listing.</li> : null}
        <li>A bundle is held for you while you pay. If the payment is not finished in time, it goes back on the shelf.</li>
      </ul>
    </aside>
  );
}
