import { formatMoney, LISTING_OFFERS, minimumCardChargeMinor, OFFER_LABELS, parseMoneyToMinor } from '@scrap-relay/shared';
import { get, useFormContext, useFormState, useWatch, type FieldError as HookFieldError } from 'react-hook-form';
import { Alert } from '../../../components/ui/alert.tsx';
import { FieldError } from '../../../components/ui/field.tsx';
import { CheckboxField, FieldGroup, TextField } from '../../../components/ui/form.tsx';
import type { ListingFormValues } from '../utils/listing-form.ts';
import { useListingWizard } from './listing-context.ts';

type ListingOffer = (typeof LISTING_OFFERS)[number];

const OFFER_DETAILS: Readonly<Record<ListingOffer, string>> = {
  sale: 'Set a price. The buyer pays it plus postage, or collects at a meeting if you allow that.',
  postage_only: 'Free to whoever asks first; they pay only the postage.',
  meeting: 'Free, handed over at a guild meeting. Nothing is posted.',
  starter: 'Donated to the starter programme: the librarian passes it to a new quilter who has little or no stash.',
};

/** Step 4: how the bundle changes hands, its price for a sale, and how many identical packs there are. */
export function OfferStep() {
  const { currency } = useListingWizard();
  const { register } = useFormContext<ListingFormValues>();
  const { errors } = useFormState<ListingFormValues>({ name: 'offer' });
  const offerError = (get(errors, 'offer') as HookFieldError | undefined)?.message;
  const [offer, priceText] = useWatch<ListingFormValues, ['offer', 'priceText']>({ name: ['offer', 'priceText'] });
  const priceMinor = offer === 'sale' && priceText ? parseMoneyToMinor(priceText, currency) : null;

  return (
    <div className="space-y-6">
      <fieldset aria-describedby={offerError ? 'offer-error' : undefined} className="space-y-3 rounded-stitch border-2 border-seam bg-muslin p-4 sm:p-6">
        <legend className="px-2 text-lg font-bold">How the bundle changes hands</legend>
        <div className="space-y-2">
          {LISTING_OFFERS.map((value) => (
            <label key={value} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-stitch border-2 border-seam p-3 has-checked:border-thread has-checked:bg-linen">
              <input type="radio" value={value} className="mt-1 size-6 shrink-0 accent-thread" {...register('offer')} />
              <span>
                <span className="block font-semibold">{OFFER_LABELS[value]}</span>
                <span className="block text-thread-soft">{OFFER_DETAILS[value]}</span>
              </span>
            </label>
          ))}
        </div>
        {offerError ? <FieldError id="offer-error">{offerError}</FieldError> : null}
      </fieldset>

      {offer === 'sale' ? (
        <FieldGroup legend="Price">
          <TextField
            name="priceText"
            label={`Price for one pack (${currency})`}
            hint={`What the buyer pays for the fabric; postage is added at checkout.${minimumCardChargeMinor(currency) > 0 ? ` At least ${formatMoney(minimumCardChargeMinor(currency), currency)}, the least a card payment can be.` : ''}`}
            inputMode="decimal"
            autoComplete="off"
            className="max-w-md"
          />
          <p aria-live="polite" className="font-semibold text-thread-soft">
            {priceMinor !== null && priceMinor > 0 ? `Buyers see ${formatMoney(priceMinor, currency)} plus postage.` : null}
          </p>
          <CheckboxField name="meetingHandoverOk" label="May also hand over at a meeting" hint="The buyer can choose to collect at a guild meeting instead of paying postage." />
          <Alert tone="info" announce={false}>
            <p>
              The guild takes payment by card and is the merchant for the sale. Its fee comes out of the price before it is passed on to you;
              fees and refunds follow the guild’s own rules and local law.
            </p>
          </Alert>
        </FieldGroup>
      ) : null}

      <FieldGroup legend="Packs">
        <TextField
          name="quantity"
          label="Number of identical packs"
          hint="More than 1 when you offer several packs that are the same, for example ten packs of 2½-inch strips. The weight is for one pack."
          inputMode="numeric"
          autoComplete="off"
          className="max-w-md"
        />
      </FieldGroup>
    </div>
  );
}
