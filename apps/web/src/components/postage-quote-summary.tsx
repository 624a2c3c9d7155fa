import { formatMoney, formatPostalWeight, type PostageQuoteView, type UnitSystem } from '@scrap-relay/shared';
import { cn } from '../utils/cn.ts';

/** The quote in a few lines, with the full working in a disclosure for anyone who wants to check it. */
export function PostageQuoteSummary({ quote, units }: { quote: PostageQuoteView; units: UnitSystem }) {
  const money = (minor: number) => formatMoney(minor, quote.currency);
  return (
    <div className="space-y-3">
      <ul className="space-y-1">
        {quote.parcels.map((parcel) => (
          <li key={parcel.number}>
            <span className="font-semibold">
              {quote.parcels.length > 1 ? `Parcel ${parcel.number}: ` : ''}
              {parcel.packageName}
            </span>
            {' — '}
            {formatPostalWeight(parcel.contentGrams, units)} of fabric, billed as {formatPostalWeight(parcel.billableGrams, units, 'up')}: {money(parcel.priceMinor)}
          </li>
        ))}
        {quote.handlingMinor > 0 ? <li>Packing and handling: {money(quote.handlingMinor)}</li> : null}
      </ul>
      <PostageWorking explanation={quote.explanation} className="bg-muslin" />
    </div>
  );
}

/** The quote's line-by-line explanation, folded away; shown with a quote and on an order that was quoted. */
export function PostageWorking({ explanation, className }: { explanation: readonly string[]; className?: string }) {
  return (
    <details className={cn('rounded-stitch border-2 border-seam p-3', className)}>
      <summary className="min-h-11 cursor-pointer py-2 font-semibold">How the postage was worked out</summary>
      <ol className="mt-2 space-y-1 text-thread-soft">
        {explanation.map((line, index) => (
          // Lines starting with spaces are the packages tried for the parcel above them.
          <li key={index} className={line.startsWith(' ') ? 'pl-6' : undefined}>
            {line.trim()}
          </li>
        ))}
      </ol>
    </details>
  );
}
