import {
  allowsFulfilment,
  formatMoney,
  orderCreateSchema,
  postalAddressSchema,
  type Fulfilment,
  type MeetingView,
  type OrderCreateInput,
  type PostalAddress,
  type PostageQuoteRequest,
  type UnitSystem,
} from '@scrap-relay/shared';
import { useId, useMemo, useState, type ReactNode } from 'react';
import { useFormContext, useFormState, useWatch } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { paths } from '../../../config/paths.ts';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { FieldError } from '../../../components/ui/field.tsx';
import { CheckboxField, Form, SubmitButton } from '../../../components/ui/form.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { isApiError, type ApiError } from '../../../lib/api-client.ts';
import { placeNestedFieldErrors } from '../../../lib/form-errors.ts';
import { useGuildPostageCountries, useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatMeetingWhen } from '../../../utils/meetings.ts';
import { usePostageQuote } from '../../../lib/postage-quotes.ts';
import { usePlaceOrder, type PlacedOrder } from '../api/place-order.ts';
import { useDebouncedValue } from '../hooks/use-debounced-value.ts';
import { addressFormValues } from '../../../utils/address-defaults.ts';
import {
  fulfilmentPlans,
  itemsSubtotalMinor,
  orderItemsOf,
  preferredFulfilment,
  type BasketLine,
  type SellerGroup,
} from '../utils/basket-lines.ts';
import { AddressFields } from './address-fields.tsx';
import { BasketLineItem } from './basket-line-item.tsx';
import { PostageQuoteSummary } from '../../../components/postage-quote-summary.tsx';

/** The post form: the shared address schema plus the "save for next time" choice the order takes. */
const postCheckoutSchema = z.object({ address: postalAddressSchema, saveAddress: z.boolean() });
/** The meeting form: the order schema's own meeting id rule. */
const meetingCheckoutSchema = z.object({ meetingId: orderCreateSchema.shape.meetingId.unwrap() });

export interface MeetingsState {
  status: 'pending' | 'error' | 'success';
  items: readonly MeetingView[];
  retry: () => void;
}

export interface SellerCheckoutProps {
  group: SellerGroup;
  units: UnitSystem;
  guildCurrency: string;
  savedAddress: PostalAddress | null;
  meetings: MeetingsState;
  /** False until the member has confirmed their e-mail address (the API refuses orders before that). */
  canOrder: boolean;
  onQuantityChange: (bundleId: string, quantity: number) => void;
  onRemove: (bundleId: string) => void;
  onPlaced: (placed: PlacedOrder, bundleIds: string[]) => void;
  /** Someone else took a bundle first: the basket checks these again. */
  onConflict: (bundleIds: string[]) => void;
}

const FULFILMENT_CHOICES: Record<Fulfilment, { label: string; hint: string }> = {
  post: { label: 'Post it to me', hint: 'Postage comes from the guild’s postage table, worked out for your postal code.' },
  meeting: { label: 'Collect it at a guild meeting', hint: 'No postage: the seller brings it to the meeting you choose.' },
};

/** One seller's bundles as one order: how it reaches the buyer, the postage quote, the totals, and payment. */
export function SellerCheckout(props: SellerCheckoutProps) {
  const { group, units, onQuantityChange, onRemove } = props;
  const plans = useMemo(() => fulfilmentPlans(group.lines), [group.lines]);
  const [chosen, setChosen] = useState<Fulfilment | null>(null);
  const fulfilment = chosen && plans.some((plan) => plan.fulfilment === chosen) ? chosen : preferredFulfilment(plans);
  const plan = plans.find((candidate) => candidate.fulfilment === fulfilment);
  const choiceName = useId();
  const currency = group.lines[0]?.bundle.currency ?? props.guildCurrency;
  const canMeet = plans.some((candidate) => candidate.fulfilment === 'meeting');

  if (!plan || !fulfilment) return null;

  return (
    <Panel title={`From ${group.seller.firstName}`}>
      <ul>
        {plan.lines.map((line) => (
          <BasketLineItem
            key={line.bundleId}
            line={line}
            units={units}
            onQuantityChange={(quantity) => onQuantityChange(line.bundleId, quantity)}
            onRemove={() => onRemove(line.bundleId)}
          />
        ))}
      </ul>

      {plans.length > 1 ? (
        <fieldset className="space-y-2">
          <legend className="text-lg font-bold">How it reaches you</legend>
          {plans.map((candidate) => {
            const id = `${choiceName}-${candidate.fulfilment}`;
            return (
              <div key={candidate.fulfilment} className="flex items-start gap-3">
                <input
                  id={id}
                  type="radio"
                  name={choiceName}
                  value={candidate.fulfilment}
                  checked={candidate.fulfilment === fulfilment}
                  onChange={() => setChosen(candidate.fulfilment)}
                  aria-describedby={`${id}-hint`}
                  className="mt-1.5 size-6 shrink-0 accent-thread"
                />
                <div className="min-h-11">
                  <label htmlFor={id} className="block cursor-pointer py-1 font-semibold">
                    {FULFILMENT_CHOICES[candidate.fulfilment].label}
                    {candidate.leftOut.length > 0 ? ` (${candidate.lines.length} of ${group.lines.length} bundles)` : null}
                  </label>
                  <p id={`${id}-hint`} className="text-thread-soft">
                    {FULFILMENT_CHOICES[candidate.fulfilment].hint}
                  </p>
                </div>
              </div>
            );
          })}
        </fieldset>
      ) : (
        <p className="font-semibold">{fulfilment === 'post' ? 'These go by post.' : 'These are handed over at a guild meeting.'}</p>
      )}

      {plan.leftOut.length > 0 ? (
        <div className="space-y-2 rounded-stitch border-2 border-dashed border-seam p-3">
          <h3 className="font-bold">Staying in your basket for a separate order</h3>
          <ul>
            {plan.leftOut.map((line) => (
              <BasketLineItem
                key={line.bundleId}
                line={line}
                units={units}
                onRemove={() => onRemove(line.bundleId)}
                note={allowsFulfilment(line.bundle, 'meeting') ? 'Handed over at a meeting only.' : 'Posted only.'}
              />
            ))}
          </ul>
        </div>
      ) : null}

      {fulfilment === 'post' ? (
        <PostCheckout {...props} lines={plan.lines} currency={currency} canMeet={canMeet} />
      ) : (
        <MeetingCheckout {...props} lines={plan.lines} currency={currency} />
      )}
    </Panel>
  );
}

interface CheckoutFormProps extends SellerCheckoutProps {
  lines: BasketLine[];
  currency: string;
}

/** Places the order; on a clash it has the basket checked again, then lets the form show the API's message. */
function useSubmitOrder({ lines, onPlaced, onConflict }: Pick<CheckoutFormProps, 'lines' | 'onPlaced' | 'onConflict'>) {
  const place = usePlaceOrder();
  return async (input: OrderCreateInput) => {
    const bundleIds = lines.map((line) => line.bundleId);
    try {
      onPlaced(await place.mutateAsync(input), bundleIds);
    } catch (error) {
      if (isApiError(error) && error.code === 'conflict') onConflict(bundleIds);
      throw error;
    }
  };
}

function checkoutErrorHelp(error: ApiError, canMeet: boolean): ReactNode {
  switch (error.code) {
    case 'conflict':
      return <p>Someone else got there first. Your basket has been checked again and anything no longer available taken out. Nothing was charged.</p>;
    case 'unprocessable':
      return canMeet ? <p>These bundles can be handed over at a guild meeting instead: choose “{FULFILMENT_CHOICES.meeting.label}” above.</p> : null;
    case 'service_unavailable':
      return <p>Nothing was taken from your card and nothing is held. Please try again in a few minutes.</p>;
    case 'email_not_verified':
      return <p>Confirm your e-mail address first, using the link in the message we sent you.</p>;
    default:
      return null;
  }
}

function PostCheckout(props: CheckoutFormProps & { canMeet: boolean }) {
  const { lines, savedAddress, guildCurrency, canMeet } = props;
  const submit = useSubmitOrder(props);
  const postageCountries = useGuildPostageCountries();
  return (
    <Form
      schema={postCheckoutSchema}
      defaultValues={{ address: addressFormValues(savedAddress, guildCurrency, postageCountries), saveAddress: savedAddress === null }}
      errorDetail={(error) => checkoutErrorHelp(error, canMeet)}
      onSubmit={async (values, methods) => {
        try {
          await submit({ items: orderItemsOf(lines), fulfilment: 'post', address: values.address, saveAddress: values.saveAddress });
        } catch (error) {
          throw placeNestedFieldErrors(error, methods, ['address.']);
        }
      }}
    >
      <fieldset className="space-y-5">
        <legend className="text-lg font-bold">Where to post it</legend>
        <AddressFields prefix="address." />
        <CheckboxField name="saveAddress" label="Save this address for next time" hint="Kept on your account; only the seller of a paid order sees it." />
        {savedAddress ? (
          <p>
            <Link to={paths.app.address.getHref()}>Change your saved address</Link>
          </p>
        ) : null}
      </fieldset>
      <PostageAndPay {...props} />
    </Form>
  );
}

/** Watches the postal code, asks for the quote once it has settled, and only offers payment against a current quote. */
function PostageAndPay({ lines, currency, units, canMeet, canOrder }: CheckoutFormProps & { canMeet: boolean }) {
  const { control } = useFormContext<z.input<typeof postCheckoutSchema>>();
  const [postalCode = '', country = ''] = useWatch({ control, name: ['address.postalCode', 'address.country'] });
  const destination = useDebouncedValue({ postalCode: postalCode.trim(), country: country.trim().toUpperCase() }, 500);
  const valid =
    postalAddressSchema.shape.postalCode.safeParse(destination.postalCode).success &&
    postalAddressSchema.shape.country.safeParse(destination.country).success;
  const request: PostageQuoteRequest | null = valid ? { items: orderItemsOf(lines), destination } : null;
  const quote = usePostageQuote(request);
  const current = quote.isSuccess && !quote.isPlaceholderData && valid;
  const itemsMinor = itemsSubtotalMinor(lines);
  const totalMinor = current ? itemsMinor + quote.data.totalMinor : null;

  let postage: ReactNode;
  if (!valid) postage = <p>Enter the postal code to see the postage.</p>;
  else if (quote.isError) {
    postage = (
      <Alert tone="warning" title="This cannot be quoted for posting">
        <p>{quote.error.message}</p>
        {canMeet && isApiError(quote.error) && quote.error.code === 'unprocessable' ? <p>Choose “{FULFILMENT_CHOICES.meeting.label}” above instead.</p> : null}
      </Alert>
    );
  } else if (!quote.data) postage = <Loading label="Working out the postage…" />;
  else {
    postage = (
      <div className="space-y-2" aria-busy={quote.isPlaceholderData || undefined}>
        {quote.isPlaceholderData ? <p role="status">Updating the postage for the new postal code…</p> : null}
        <PostageQuoteSummary quote={quote.data} units={units} />
      </div>
    );
  }

  return (
    <>
      <section aria-label="Postage quote" className="space-y-3">
        <h3 className="text-lg font-bold">Postage</h3>
        {postage}
      </section>
      <OrderTotals currency={currency} itemsMinor={itemsMinor} postage={current ? { minor: quote.data.totalMinor } : 'pending'} />
      <SubmitButton pendingLabel="Holding your bundles…" disabled={!current || !canOrder}>
        {totalMinor !== null ? `Pay ${formatMoney(totalMinor, currency)} by card` : 'Pay by card'}
      </SubmitButton>
      <p className="text-thread-soft">You pay on the card payment page; the bundles are held for you while you do.</p>
    </>
  );
}

function MeetingCheckout(props: CheckoutFormProps) {
  const { lines, currency, meetings, canOrder } = props;
  const submit = useSubmitOrder(props);
  const itemsMinor = itemsSubtotalMinor(lines);

  if (meetings.status === 'pending') return <Loading label="Loading the guild’s meetings…" />;
  if (meetings.status === 'error') {
    return (
      <Alert tone="error" title="The guild’s meetings could not be loaded">
        <Button variant="secondary" onClick={meetings.retry}>
          Try again
        </Button>
      </Alert>
    );
  }
  if (meetings.items.length === 0) {
    return (
      <Alert tone="info" title="No meetings are planned yet" announce={false}>
        <p>When the guild adds its next meeting you can choose it here.</p>
      </Alert>
    );
  }

  return (
    <Form
      schema={meetingCheckoutSchema}
      defaultValues={{ meetingId: meetings.items[0]?.id ?? '' }}
      errorDetail={(error) => checkoutErrorHelp(error, false)}
      onSubmit={(values) => submit({ items: orderItemsOf(lines), fulfilment: 'meeting', meetingId: values.meetingId })}
    >
      <MeetingChoice meetings={meetings.items} />
      <OrderTotals currency={currency} itemsMinor={itemsMinor} postage="none" />
      <SubmitButton pendingLabel={itemsMinor > 0 ? 'Holding your bundles…' : 'Confirming…'} disabled={!canOrder}>
        {itemsMinor > 0 ? `Pay ${formatMoney(itemsMinor, currency)} by card` : 'Confirm: I will collect it at the meeting'}
      </SubmitButton>
    </Form>
  );
}

function MeetingChoice({ meetings }: { meetings: readonly MeetingView[] }) {
  const { register } = useFormContext<{ meetingId: string }>();
  const { errors } = useFormState<{ meetingId: string }>({ name: 'meetingId' });
  const timeZone = useGuildTimeZone();
  const base = useId();
  const errorId = `${base}-error`;
  const message = errors.meetingId?.message;
  return (
    <fieldset className="space-y-2" aria-describedby={message ? errorId : undefined}>
      <legend className="text-lg font-bold">Which meeting</legend>
      {meetings.map((meeting) => {
        const id = `${base}-${meeting.id}`;
        return (
          <div key={meeting.id} className="flex items-start gap-3">
            <input id={id} type="radio" value={meeting.id} {...register('meetingId')} className="mt-1.5 size-6 shrink-0 accent-thread" />
            <label htmlFor={id} className="min-h-11 cursor-pointer py-1">
              <span className="block font-semibold">{formatMeetingWhen(meeting.startsAt, timeZone)}</span>
              <span className="block text-thread-soft">{meeting.place}</span>
              {meeting.notes ? <span className="block text-thread-soft">{meeting.notes}</span> : null}
            </label>
          </div>
        );
      })}
      {message ? <FieldError id={errorId}>{message}</FieldError> : null}
    </fieldset>
  );
}

type PostageLine = { minor: number } | 'pending' | 'none';

function OrderTotals({ currency, itemsMinor, postage }: { currency: string; itemsMinor: number; postage: PostageLine }) {
  const money = (minor: number) => formatMoney(minor, currency);
  const postageMinor = typeof postage === 'object' ? postage.minor : 0;
  return (
    <dl aria-label="Order total" className="grid grid-cols-[1fr_auto] gap-y-1 rounded-stitch bg-linen p-4">
      <dt>Bundles</dt>
      <dd className="pl-6 text-right">{itemsMinor > 0 ? money(itemsMinor) : 'Free'}</dd>
      <dt>Postage</dt>
      <dd className="pl-6 text-right">{postage === 'none' ? 'None' : postage === 'pending' ? '—' : money(postage.minor)}</dd>
      <dt className="border-t-2 border-thread pt-1 font-bold">Total</dt>
      <dd className="border-t-2 border-thread pt-1 pl-6 text-right font-bold">{postage === 'pending' ? '—' : money(itemsMinor + postageMinor)}</dd>
    </dl>
  );
}
