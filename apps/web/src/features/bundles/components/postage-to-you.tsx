import { formatMoney, postageQuoteRequestSchema, type BundleView, type UnitSystem } from '@scrap-relay/shared';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Panel } from '../../../components/layouts/page.tsx';
import { PostageQuoteSummary } from '../../../components/postage-quote-summary.tsx';
import { CountryField, PostalCodeField } from '../../../components/postal-fields.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Form, SubmitButton } from '../../../components/ui/form.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { useMyAddress } from '../../../lib/my-address.ts';
import { usePostageQuote } from '../../../lib/postage-quotes.ts';
import { defaultCountryFor } from '../../../utils/address-defaults.ts';

/** The same country and postal-code rules the API applies to a quote. */
const destinationSchema = postageQuoteRequestSchema.shape.destination;
type Destination = { country: string; postalCode: string };

/**
 * Whether this viewer may have the bundle posted to them: a sale or postage-only bundle they may buy (the API's
 * `buy` ability already leaves out their own bundles).
 */
const quotesPostageFor = (bundle: BundleView): boolean => (bundle.offer === 'sale' || bundle.offer === 'postage_only') && bundle.abilities.buy;

export interface PostageToYouProps {
  bundle: BundleView;
  units: UnitSystem;
}

/**
 * What posting one of this bundle to the member would cost, before they commit: to their saved address at once,
 * or to a postal code they try.
 */
export function PostageToYou({ bundle, units }: PostageToYouProps) {
  if (!quotesPostageFor(bundle)) return null;
  return (
    <Panel title="Postage to you">
      <SavedOrTried bundle={bundle} units={units} />
      <p className="text-thread-soft">
        Bundles from one seller go in one parcel, so in your basket the postage per bundle may come to less.
      </p>
    </Panel>
  );
}

function SavedOrTried({ bundle, units }: PostageToYouProps) {
  const address = useMyAddress();
  const [tried, setTried] = useState<Destination | null>(null);
  const [trying, setTrying] = useState(false);

  if (address.isPending) return <Loading label="Looking up your saved address…" />;
  // Without the saved address (none, or it could not be read), the member can still try a postal code.
  const saved = address.data?.address ?? null;
  const destination = tried ?? (saved ? { country: saved.country, postalCode: saved.postalCode } : null);
  const showForm = trying || !saved;

  return (
    <div className="space-y-4">
      {destination ? <QuoteTo bundle={bundle} units={units} destination={destination} toSavedAddress={tried === null} /> : null}
      {showForm ? (
        <TryPostalCode
          start={destination ?? { country: defaultCountryFor(bundle.currency), postalCode: '' }}
          onTry={setTried}
          onBack={
            saved
              ? () => {
                  setTried(null);
                  setTrying(false);
                }
              : undefined
          }
        />
      ) : (
        <Button variant="secondary" onClick={() => setTrying(true)}>
          Try another postal code
        </Button>
      )}
      {saved ? null : (
        <p>
          <Link to={paths.app.address.getHref()}>Save your postal address</Link> and the postage is worked out for you here and in your basket.
        </p>
      )}
    </div>
  );
}

function QuoteTo({ bundle, units, destination, toSavedAddress }: { bundle: BundleView; units: UnitSystem; destination: Destination; toSavedAddress: boolean }) {
  const quote = usePostageQuote({ items: [{ bundleId: bundle.id, quantity: 1 }], destination });
  const where = `${destination.postalCode}, ${destination.country}${toSavedAddress ? ' (your saved address)' : ''}`;

  if (quote.isError) {
    const error = quote.error;
    if (isApiError(error) && error.status === 422) {
      const tooHeavy = 'items' in error.fields;
      return (
        <Alert tone="warning" title={`No postage quote to ${where}`}>
          <p>{error.message}</p>
          {tooHeavy && bundle.meetingHandoverOk ? (
            <p>In your basket, choose “Collect it at a guild meeting”: there is no postage to pay.</p>
          ) : null}
        </Alert>
      );
    }
    return (
      <Alert tone="error" title="The postage could not be worked out">
        <p>{error.message}</p>
        <Button variant="secondary" onClick={() => quote.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  if (!quote.data || quote.isPlaceholderData) return <Loading label="Working out the postage…" />;

  const money = (minor: number) => formatMoney(minor, quote.data.currency);
  return (
    <div className="space-y-3">
      <p role="status" className="space-y-1">
        <span className="block text-thread-soft">To {where}</span>
        <span className="block text-2xl font-bold">{money(quote.data.totalMinor)}</span>
      </p>
      {bundle.offer === 'postage_only' ? (
        <p>The bundle itself is free: the postage is all you pay.</p>
      ) : bundle.priceMinor !== null ? (
        <p>
          With the price of {bundle.quantity > 1 ? 'one pack' : 'the bundle'}: {money(bundle.priceMinor + quote.data.totalMinor)}.
        </p>
      ) : null}
      <PostageQuoteSummary quote={quote.data} units={units} />
    </div>
  );
}

function TryPostalCode({ start, onTry, onBack }: { start: Destination; onTry: (destination: Destination) => void; onBack?: () => void }) {
  return (
    <Form schema={destinationSchema} defaultValues={start} onSubmit={onTry} className="space-y-4 rounded-stitch border-2 border-seam bg-linen p-4">
      <h3 className="font-semibold">Try a postal code</h3>
      <div className="grid gap-4 sm:grid-cols-2">
        <PostalCodeField name="postalCode" />
        <CountryField name="country" />
      </div>
      <div className="flex flex-wrap gap-3">
        <SubmitButton>Show the postage</SubmitButton>
        {onBack ? (
          <Button variant="secondary" onClick={onBack}>
            Back to your saved address
          </Button>
        ) : null}
      </div>
    </Form>
  );
}
