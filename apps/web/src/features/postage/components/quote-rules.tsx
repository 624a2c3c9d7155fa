/** The quote rules in words (they are the shared quotePostage function's, in the same order), for the admin editing the table. */
export function QuoteRules() {
  return (
    <details open className="rounded-stitch border-2 border-seam bg-muslin p-4">
      <summary className="min-h-11 cursor-pointer py-2 text-lg font-bold">How a postage quote is worked out</summary>
      <ol className="mt-3 list-decimal space-y-2 pl-6">
        <li>
          <strong>Zone.</strong> The buyer’s postal code is matched against each zone’s prefixes, zones in the order listed; the first zone
          with a prefix the code starts with wins (spaces and capitals ignored). The prefix <code>*</code> matches every code, so put a
          catch-all zone last.
        </li>
        <li>
          <strong>Parcels.</strong> Every bundle (each copy counts) is packed heaviest first into the first parcel it fits, up to what the
          largest package can hold (its maximum less its own weight). A bundle heavier than that cannot be posted: the buyer is told to
          choose a meeting handover.
        </li>
        <li>
          <strong>Package.</strong> Each parcel goes in whichever package that holds it costs least: its flat price if it has one,
          otherwise the weight band price. On a tie, the smaller package.
        </li>
        <li>
          <strong>Billable weight.</strong> Contents plus the package’s own weight (tare), or the dimensional weight if that is more. The
          dimensional weight counts only when the package’s volume in cubic inches is over the threshold: volume ÷ divisor, rounded up to
          whole pounds.
        </li>
        <li>
          <strong>Band.</strong> The first band of the zone, lightest first, whose limit covers the billable weight. No band covers it: no
          quote.
        </li>
        <li>
          <strong>Total.</strong> The parcels’ prices added up, plus the handling charge once per order.
        </li>
      </ol>
    </details>
  );
}
