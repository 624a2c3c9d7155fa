import { disputeReasonLabel, disputeStatusLabel, formatMoney, type OrderDisputeView, type OrderView } from '@scrap-relay/shared';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert, type AlertTone } from '../../../components/ui/alert.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatTimestamp } from '../../../utils/meetings.ts';

const TONES: Record<OrderDisputeView['stage'], AlertTone> = { open: 'warning', lost: 'error', won: 'success', closed: 'info' };

/**
 * The buyer's bank questioning the card payment. The treasurer, who answers it, gets the whole story; the seller a
 * plain word of what it means for them; the API sends it to nobody else.
 */
export function DisputePanel({ order, dispute }: { order: OrderView; dispute: OrderDisputeView }) {
  const timeZone = useGuildTimeZone();
  const when = (iso: string) => formatTimestamp(iso, timeZone);
  if (dispute.status === null) return <SellerDisputeNote dispute={dispute} notSentYet={order.state === 'confirmed'} />;
  const open = dispute.stage === 'open';
  return (
    <Panel title="Card payment dispute">
      <Alert tone={TONES[dispute.stage]} title={disputeStatusLabel(dispute.status)} announce={false}>
        <p>{STAGE_NOTES[dispute.stage]}</p>
      </Alert>
      <dl className="grid gap-x-6 sm:grid-cols-[12rem_1fr] sm:gap-y-2 max-sm:[&>dd]:mb-3">
        <dt className="font-semibold text-thread-soft">Amount disputed</dt>
        <dd className="font-bold">{dispute.amountMinor === null ? '—' : formatMoney(dispute.amountMinor, order.currency)}</dd>
        <dt className="font-semibold text-thread-soft">Card service’s dispute fee</dt>
        <dd>{dispute.feeMinor ? `${formatMoney(dispute.feeMinor, order.currency)}, the guild’s cost` : 'None'}</dd>
        <dt className="font-semibold text-thread-soft">Reason the bank gave</dt>
        <dd>{dispute.reason === null ? '—' : disputeReasonLabel(dispute.reason)}</dd>
        <dt className="font-semibold text-thread-soft">Opened</dt>
        <dd>
          <time dateTime={dispute.openedAt}>{when(dispute.openedAt)}</time>
        </dd>
        {open ? (
          <>
            <dt className="font-semibold text-thread-soft">Evidence due by</dt>
            <dd className={dispute.evidenceDueBy ? 'font-bold' : undefined}>
              {dispute.evidenceDueBy ? <time dateTime={dispute.evidenceDueBy}>{when(dispute.evidenceDueBy)}</time> : 'The bank has not asked for evidence'}
            </dd>
          </>
        ) : null}
        {dispute.closedAt ? (
          <>
            <dt className="font-semibold text-thread-soft">Decided</dt>
            <dd>
              <time dateTime={dispute.closedAt}>{when(dispute.closedAt)}</time>
            </dd>
          </>
        ) : null}
      </dl>
      {open ? (
        <p>
          The guild answers in the card service’s own dashboard, not here. Useful evidence from this order:{' '}
          {order.trackingNumber ? `the tracking number ${order.trackingNumber}, ` : ''}
          {order.postedAt ? `the posting date (${when(order.postedAt)}), ` : ''}
          {order.handedOverAt ? `the handover at the meeting (${when(order.handedOverAt)}), ` : ''}
          the bundles’ listing and photos, and any messages with the buyer.
        </p>
      ) : null}
      <p className="text-thread-soft">Disputes follow the card networks’ rules and local law; the card service’s dashboard has the details of this one.</p>
    </Panel>
  );
}

const STAGE_NOTES: Record<OrderDisputeView['stage'], string> = {
  open: 'While the bank decides, the order cannot be refunded or cancelled. The ledger holds the card service’s dispute fee as the guild’s cost; the order’s own money changes only if the guild loses.',
  lost: 'The money went back to the buyer’s card. The ledger shows the seller’s credit and the guild’s fee for this order taken back, and the card service’s dispute fee as the guild’s cost.',
  won: 'The money stays with the guild, and the seller’s credit with it. The ledger shows the card service’s dispute fee, and gives it back if the card service did.',
  closed: 'The bank closed its questions without taking the money back. The seller’s credit stands.',
};

const SELLER_NOTES: Record<OrderDisputeView['stage'], { title: string; text: string }> = {
  open: {
    title: 'The buyer’s bank is looking into the card payment for this order',
    text: 'The guild’s treasurer answers the bank. Keep your proof of posting: the treasurer may ask you for it. Your credit for this order stays unless the bank decides for the buyer.',
  },
  lost: {
    title: 'The buyer’s bank took the card payment back',
    text: 'Your credit for this order was taken back with it. The treasurer can tell you more.',
  },
  won: { title: 'The buyer’s bank looked into the card payment', text: 'It decided for the guild: nothing changes for you.' },
  closed: { title: 'The buyer’s bank looked into the card payment', text: 'It left the payment with the guild: nothing changes for you.' },
};

/** `notSentYet`: the bundles have not gone out, so after a lost dispute the seller asks before sending them. */
function SellerDisputeNote({ dispute, notSentYet }: { dispute: OrderDisputeView; notSentYet: boolean }) {
  const note = SELLER_NOTES[dispute.stage];
  return (
    <Alert tone={dispute.stage === 'lost' ? 'warning' : 'info'} title={note.title} announce={false}>
      <p>{note.text}</p>
      {dispute.stage === 'open' && notSentYet ? <p className="font-semibold">The bundles have not gone out yet: keep them until the treasurer tells you whether to send them.</p> : null}
      {dispute.stage === 'lost' && notSentYet ? <p className="font-semibold">The bundles have not gone out yet: ask the treasurer before you send them.</p> : null}
    </Alert>
  );
}
