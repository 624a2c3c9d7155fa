import { formatMoney, formatWeight, type OrderView, type PostalAddress, type UnitSystem } from '@scrap-relay/shared';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Panel } from '../../../components/layouts/page.tsx';
import { PostageWorking } from '../../../components/postage-quote-summary.tsx';
import { PostalAddressLines } from '../../../components/postal-address.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatMeetingWhen, formatTimestamp } from '../../../utils/meetings.ts';
import type { PaymentWait } from '../hooks/use-order-after-payment.ts';
import { orderNextStep, orderTimeline, postingAddressLabel } from '../utils/order-story.ts';
import { DisputePanel } from './dispute-panel.tsx';
import { OrderActions } from './order-actions.tsx';
import { OrderStatusBadge } from './order-status-badge.tsx';

export interface OrderDetailsProps {
  order: OrderView;
  units: UnitSystem;
  /** Set when the buyer has just come back from the payment page. */
  payment: PaymentWait | null;
}

/** The order page's content for whoever is looking: buyer, seller, or an officer (treasurer). */
export function OrderDetails({ order, units, payment }: OrderDetailsProps) {
  const openProblems = order.problems.filter((problem) => !problem.resolvedAt);
  const money = (minor: number) => formatMoney(minor, order.currency);
  // Times in the guild's zone (its meetings' and e-mails'), whatever the device's clock says.
  const timeZone = useGuildTimeZone();
  const when = (iso: string) => formatTimestamp(iso, timeZone);
  // Card-payment notes only where a card is, or was, asked for something: not a free order, nor one cancelled unpaid.
  const charged = order.chargeMinor > 0 && (order.state !== 'cancelled' || order.paidAt !== null);
  // A dispute the guild lost: the payment went back to the buyer's card, and the seller's credit with it.
  const takenBack = order.dispute?.stage === 'lost' && !order.refundedAt;
  return (
    <div className="space-y-6">
      {payment ? <PaymentNotice wait={payment} order={order} /> : null}

      {order.viewerIs === 'officer' && openProblems.length > 0 ? (
        <Alert tone="warning" title={openProblems.length === 1 ? 'The buyer reported a problem' : `The buyer reported ${openProblems.length} problems`} announce={false}>
          <ul className="space-y-1">
            {openProblems.map((problem) => (
              <li key={problem.id}>
                “{problem.message}” <span className="text-thread-soft">({when(problem.createdAt)})</span>
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}

      {order.viewerIs === 'seller' && openProblems.length > 0 ? (
        <Alert tone="info" title="The buyer reported a problem with this order" announce={false}>
          <p>
            The guild’s treasurer is looking into it and may ask you for the tracking number or how the bundles were packed. What the buyer wrote is
            for the treasurer; please leave it to the treasurer to contact the buyer about it.
          </p>
        </Alert>
      ) : null}

      {order.dispute ? <DisputePanel order={order} dispute={order.dispute} /> : null}

      <Panel>
        <div className="flex flex-wrap items-center gap-3">
          <OrderStatusBadge state={order.state} />
          <span className="text-thread-soft">Placed {when(order.createdAt)}</span>
        </div>
        <p className="text-lg">{orderNextStep(order)}</p>
        <OrderActions order={order} />
      </Panel>

      <Panel title={order.items.length === 1 ? 'Bundle' : 'Bundles'}>
        <ul>
          {order.items.map((item) => (
            <li key={item.bundleId} className="flex gap-3 border-b border-seam py-3 last:border-b-0">
              {item.thumbUrl ? (
                <img src={item.thumbUrl} alt={`Photo of “${item.title}”`} width={80} height={80} className="size-20 shrink-0 rounded-stitch border border-seam object-cover" />
              ) : (
                <span aria-hidden="true" className="size-20 shrink-0 rounded-stitch border border-seam bg-linen-deep" />
              )}
              <div className="min-w-0 space-y-1">
                <Link to={paths.app.bundle.getHref(item.bundleId)} className="font-semibold">
                  {item.title}
                </Link>
                <p className="text-thread-soft">
                  {item.quantity > 1 ? `${item.quantity} × ` : ''}
                  {formatWeight(item.weightGrams, units)}
                  {' · '}
                  {item.unitPriceMinor > 0 ? `${money(item.unitPriceMinor)}${item.quantity > 1 ? ' each' : ''}` : 'Free'}
                </p>
              </div>
            </li>
          ))}
        </ul>
      </Panel>

      <Panel title="Money">
        <dl className="grid max-w-md grid-cols-[1fr_auto] gap-x-6 gap-y-1">
          <MoneyRow label="Bundles" value={order.subtotalMinor > 0 ? money(order.subtotalMinor) : 'Free'} />
          <MoneyRow label="Postage" value={order.fulfilment === 'meeting' ? 'None' : money(order.postageMinor)} />
          <MoneyRow label={order.paidAt && order.chargeMinor > 0 ? 'Total paid' : 'Total'} value={money(order.chargeMinor)} strong />
          {order.guildFeeMinor !== null ? <MoneyRow label="Guild fee (on the bundles’ price)" value={`− ${money(order.guildFeeMinor)}`} /> : null}
          {order.sellerCreditMinor !== null ? (
            <MoneyRow label={order.viewerIs === 'seller' ? 'Your credit (price less fee, plus postage)' : 'Seller’s credit'} value={money(order.sellerCreditMinor)} strong />
          ) : null}
          {takenBack ? (
            <MoneyRow
              label="Taken back by the buyer’s bank"
              value={order.dispute?.amountMinor ? `− ${money(order.dispute.amountMinor)}, with the credit and the fee` : 'With the credit and the fee'}
            />
          ) : null}
        </dl>
        {order.viewerIs === 'seller' && order.sellerCreditMinor !== null && order.sellerCreditMinor > 0 && !takenBack ? (
          <p className="text-thread-soft">
            {order.fulfilment === 'post'
              ? 'The treasurer pays out your credit once you have marked the parcel posted; the postage part covers what you pay to post it.'
              : 'The treasurer pays out your credit once the bag has been handed over at the meeting.'}
          </p>
        ) : null}
        {charged ? (
          <p className="text-thread-soft">The guild is the merchant for card payments. Fees and refunds follow the guild’s own rules and local law.</p>
        ) : null}
      </Panel>

      <Panel title={order.fulfilment === 'post' ? 'By post' : 'Meeting handover'}>
        {order.fulfilment === 'post' ? <PostingDetails order={order} when={when} /> : <MeetingDetails order={order} timeZone={timeZone} />}
        {order.postageExplanation.length > 0 ? <PostageWorking explanation={order.postageExplanation} className="bg-linen" /> : null}
      </Panel>

      <Panel title="Who">
        <dl className="grid gap-x-6 sm:grid-cols-[10rem_1fr] sm:gap-y-2 max-sm:[&>dd]:mb-3">
          <Person label={order.viewerIs === 'buyer' ? 'You' : 'Buyer'} person={order.buyer} />
          <Person label={order.viewerIs === 'seller' ? 'You' : 'Seller'} person={order.seller} />
        </dl>
      </Panel>

      <Panel title="History">
        <ol className="space-y-3 border-l-4 border-seam pl-4">
          {orderTimeline(order).map((event) => (
            <li key={event.key}>
              <p className="font-semibold">{event.title}</p>
              <p className="text-thread-soft">
                <time dateTime={event.at}>{when(event.at)}</time>
              </p>
              {event.detail ? <p className="[overflow-wrap:anywhere]">{event.detail}</p> : null}
            </li>
          ))}
        </ol>
      </Panel>
    </div>
  );
}

function PaymentNotice({ wait, order }: { wait: PaymentWait; order: OrderView }) {
  if (wait === 'confirmed') {
    return (
      <Alert tone="success" title="Payment received: your order is confirmed">
        <p>
          {order.seller.name} has been told{order.fulfilment === 'post' ? ' and will post it to you' : ''}. A confirmation is on its way to your e-mail.
        </p>
      </Alert>
    );
  }
  if (wait === 'slow') {
    return (
      <Alert tone="warning" title="Your payment is taking longer than usual to confirm">
        <p>If the payment page said it went through, it did: this page updates by itself once the guild’s account has heard. You can also reload in a minute.</p>
      </Alert>
    );
  }
  return (
    <Alert tone="info" title="Thank you. Confirming your payment…">
      <p>The card payment service tells the guild in a moment; this page updates by itself.</p>
    </Alert>
  );
}

function PostingDetails({ order, when }: { order: OrderView; when: (iso: string) => string }) {
  return (
    <div className="space-y-3">
      {order.address ? (
        <AddressBlock label={postingAddressLabel(order)} address={order.address} />
      ) : (
        <p>
          {order.state === 'awaiting_payment'
            ? 'The buyer’s address appears here once the order is paid.'
            : 'The address is only shown to the people on this order.'}
        </p>
      )}
      {order.postedAt ? (
        <p>
          Posted {when(order.postedAt)}
          {order.trackingNumber ? (
            <>
              , tracking number <strong className="[overflow-wrap:anywhere]">{order.trackingNumber}</strong>
            </>
          ) : ' (no tracking number)'}
          .
        </p>
      ) : null}
    </div>
  );
}

function MeetingDetails({ order, timeZone }: { order: OrderView; timeZone: string }) {
  if (!order.meeting) return <p>The meeting for this handover is no longer listed; ask the guild’s librarian.</p>;
  return (
    <div className="space-y-1">
      <p className="font-semibold">{formatMeetingWhen(order.meeting.startsAt, timeZone)}</p>
      <p>{order.meeting.place}</p>
      {order.meeting.notes ? <p className="text-thread-soft">{order.meeting.notes}</p> : null}
      <p className="text-thread-soft">The librarian ticks the handover off at the door, using the reference {order.reference}.</p>
    </div>
  );
}

export function AddressBlock({ label, address }: { label: string; address: PostalAddress }) {
  return (
    <div>
      <p className="font-semibold">{label}</p>
      <PostalAddressLines address={address} />
    </div>
  );
}

function MoneyRow({ label, value, strong }: { label: string; value: ReactNode; strong?: boolean }) {
  return (
    <>
      <dt className={strong ? 'font-bold' : undefined}>{label}</dt>
      <dd className={strong ? 'text-right font-bold' : 'text-right'}>{value}</dd>
    </>
  );
}

function Person({ label, person }: { label: string; person: OrderView['buyer'] }) {
  return (
    <>
      <dt className="font-semibold text-thread-soft">{label}</dt>
      <dd>
        {person.name}
        {person.email ? (
          <>
            {' · '}
            <a href={`mailto:${person.email}`} className="[overflow-wrap:anywhere]">
              {person.email}
            </a>
          </>
        ) : null}
      </dd>
    </>
  );
}
