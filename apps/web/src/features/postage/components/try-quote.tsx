import { formatMoney, formatWeight, postageTableSchema, quotePostage, type UnitSystem } from '@scrap-relay/shared';
import { useId, useState } from 'react';
import { useWatch } from 'react-hook-form';
import { Alert } from '../../../components/ui/alert.tsx';
import { controlClass, FieldShell, Input } from '../../../components/ui/field.tsx';
import { readWeights } from '../utils/read-weights.ts';

/**
 * A quote on the table as it stands in the form, before saving: the same shared
 * quotePostage the API runs, so what shows here is what buyers will be quoted.
 */
export function TryQuote({ currency, units }: { currency: string; units: UnitSystem }) {
  const values = useWatch();
  const weightsId = useId();
  const [weightsText, setWeightsText] = useState(units === 'metric' ? '450 g\n300 g' : '1 lb\n10 oz');
  const [postalCode, setPostalCode] = useState('');
  const table = postageTableSchema.safeParse(values);
  const weights = readWeights(weightsText, units);

  let outcome;
  if (!table.success) {
    outcome = <Alert tone="warning" title="Fix the marked fields in the table to try a quote" announce={false} />;
  } else if (weights.grams.length === 0 || !postalCode.trim()) {
    outcome = <p className="text-thread-soft">Enter at least one weight and a postal code.</p>;
  } else {
    const result = quotePostage({
      table: table.data,
      items: weights.grams.map((grams, index) => ({ ref: `Bundle ${index + 1}`, grams })),
      postalCode: postalCode.trim(),
      currency,
      units,
    });
    outcome = result.ok ? (
      <div className="space-y-2">
        <p className="text-lg">
          Postage: <strong>{formatMoney(result.quote.totalMinor, currency)}</strong> (zone {result.quote.zone})
        </p>
        <ul className="space-y-1">
          {result.quote.parcels.map((parcel) => (
            <li key={parcel.number}>
              Parcel {parcel.number}: {parcel.packageName}, billed as {formatWeight(parcel.billableGrams, units)}, {formatMoney(parcel.priceMinor, currency)}
            </li>
          ))}
        </ul>
        <ol className="space-y-1 border-t border-seam pt-2 text-thread-soft">
          {result.quote.explanation.map((line, index) => (
            <li key={index} className={line.startsWith(' ') ? 'pl-4' : undefined}>
              {line.trim()}
            </li>
          ))}
        </ol>
      </div>
    ) : (
      <Alert tone="warning" title="No quote" announce={false}>
        <p>{result.error.message}</p>
      </Alert>
    );
  }

  return (
    <section aria-labelledby={`${weightsId}-title`} className="space-y-4 rounded-stitch border-2 border-thread bg-muslin p-4 lg:sticky lg:top-4">
      <h2 id={`${weightsId}-title`} className="text-xl font-bold">
        Try a quote
      </h2>
      <p className="text-thread-soft">Uses the table as it is in the form now, saved or not.</p>
      <FieldShell
        label="Bundle weights, one per line"
        hint={units === 'metric' ? 'For example 450 g or 1.2 kg.' : 'For example 1 lb 4 oz or 12 oz.'}
        error={weights.unreadable.length > 0 ? `Line ${weights.unreadable.join(', ')} is not a weight.` : undefined}
      >
        {(control) => (
          <textarea {...control} rows={3} className={controlClass} value={weightsText} onChange={(event) => setWeightsText(event.target.value)} />
        )}
      </FieldShell>
      <FieldShell label="Postal code">
        {(control) => (
          <Input {...control} autoComplete="off" spellCheck={false} value={postalCode} onChange={(event) => setPostalCode(event.target.value)} className="max-w-48" />
        )}
      </FieldShell>
      <div aria-live="polite">{outcome}</div>
    </section>
  );
}
