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
  if (dispute.status === null) return <SellerDisputeNote order={order} dispute={dispute} />;
  const open = dispute.stage === 'open';
  return (
    <Panel title="Card payment dispute">
      <Alert tone={TONES[dispute.stage]} title={disputeStatusLabel(dispute.status)} announce={false}>
        <p>{stageNote(order, dispute)}</p>
        {waitingNote(order, dispute) ? <p className="font-semibold">{waitingNote(order, dispute)}</p> : null}
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

/** The treasurer's note for each stage; the dispute fee is named only when the card service charged one. */
function stageNote(order: OrderView, dispute: OrderDisputeView): string {
  const fee = dispute.feeMinor ? ' The ledger holds the card service’s dispute fee as the guild’s cost.' : '';
  if (dispute.stage === 'lost' && order.refundedAt) {
    return `The money went back to the buyer’s card after the guild had refunded the order already: no credit was left to take back, so the guild bears it.${fee}`;
  }
  switch (dispute.stage) {
    case 'open':
      return `While the bank decides, the order cannot be refunded or cancelled; its own money changes only if the guild loses.${fee}`;
    case 'lost':
      return dispute.feeMinor
        ? 'The money went back to the buyer’s card. The ledger shows the seller’s credit and the guild’s fee for this order taken back, and the card service’s dispute fee as the guild’s cost.'
        : 'The money went back to the buyer’s card. The ledger shows the seller’s credit and the guild’s fee for this order taken back.';
    case 'won':
      return `The money stays with the guild, and the seller’s credit with it.${fee}`;
    case 'closed':
      return 'The bank closed its questions without taking the money back. The seller’s credit stands.';
  }
}

/** For the treasurer: bundles not yet out wait for their word, and the seller has been told so. */
function waitingNote(order: OrderView, dispute: OrderDisputeView): string | null {
  if (order.state !== 'confirmed' || (dispute.stage !== 'open' && dispute.stage !== 'lost')) return null;
  const give = order.fulfilment === 'post' ? 'send them' : 'bring them to the meeting';
  return dispute.stage === 'open'
    ? `The bundles have not gone out: ${order.seller.name} has been asked to keep them until you say whether to ${give}.`
    : `The bundles have not gone out: ${order.seller.name} has been asked to keep them until you say what to do with them.`;
}

const SELLER_NOTES: Record<OrderDisputeView['stage'], { title: string; text: string }> = {
  open: {
    title: 'The buyer’s bank is looking into the card payment for this order',
    text: 'The guild’s treasurer answers the bank. Your credit for this order stays unless the bank decides for the buyer.',
  },
  lost: {
    title: 'The buyer’s bank took the card payment back',
    text: 'Your credit for this order was taken back with it. The treasurer can tell you more.',
  },
  won: { title: 'The buyer’s bank looked into the card payment', text: 'It decided for the guild: nothing changes for you.' },
  closed: { title: 'The buyer’s bank looked into the card payment', text: 'It left the payment with the guild: nothing changes for you.' },
};

/** What the seller does with the bundles, from where they are: the same words as the seller's e-mails. */
function bundlesNote(order: OrderView, stage: OrderDisputeView['stage']): string | null {
  const give = order.fulfilment === 'post' ? 'send them' : 'bring them to the meeting';
  if (order.state === 'confirmed') {
    if (stage === 'open') return `The bundles have not gone out yet: keep them until the treasurer tells you whether to ${give}.`;
    if (stage === 'lost') return `The bundles have not gone out: please do not ${give} until the treasurer tells you what to do.`;
    return null;
  }
  if (stage !== 'open') return null;
  if (order.state === 'posted' || order.state === 'received') return 'Keep your proof of posting (the tracking number or the post office’s receipt): the treasurer may ask you for it.';
  if (order.state === 'handed_over') return 'The bundles were handed over at a guild meeting; the treasurer may ask you about the handover.';
  return null;
}

function SellerDisputeNote({ order, dispute }: { order: OrderView; dispute: OrderDisputeView }) {
  // Cancelled or refunded before the bank acted: no credit and no bundles are in play.
  const settled = order.state === 'refunded' || (order.state === 'cancelled' && order.refundedAt !== null);
  const note = settled ? { ...SELLER_NOTES[dispute.stage], text: 'The order was cancelled or refunded already, so nothing changes for you.' } : SELLER_NOTES[dispute.stage];
  const bundles = bundlesNote(order, dispute.stage);
  return (
    <Alert tone={dispute.stage === 'lost' ? 'warning' : 'info'} title={note.title} announce={false}>
      <p>{note.text}</p>
      {bundles ? <p className="font-semibold">{bundles}</p> : null}
    </Alert>
  );
}
