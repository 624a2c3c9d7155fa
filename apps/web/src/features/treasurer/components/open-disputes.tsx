import { disputeReasonLabel, disputeStatusLabel, formatMoney, type OrderView } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { paths } from '../../../config/paths.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { formatShortDateTime } from '../../../utils/meetings.ts';
import { useOpenDisputes } from '../api/get-open-disputes.ts';

/** Card payments a buyer's bank is disputing now, above the ledger they may change; nothing when there are none. */
export function OpenDisputes() {
  const disputes = useOpenDisputes();
  if (disputes.isError) {
    return (
      <Alert tone="error" title="The open disputes could not be loaded">
        <p>{disputes.error.message}</p>
        <Button variant="secondary" onClick={() => disputes.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  const orders = disputes.data?.items ?? [];
  if (orders.length === 0) return null;
  return (
    <Panel title={orders.length === 1 ? 'A card payment is disputed' : `${orders.length} card payments are disputed`}>
      <p>The buyer’s bank is deciding. The guild answers each in the card service’s own dashboard, before the date given; the card service’s dispute fee is booked when a dispute opens, and the order’s own money changes only if the guild loses.</p>
      <ul className="space-y-3">
        {orders.map((order) => (
          <DisputedOrder key={order.id} order={order} />
        ))}
      </ul>
    </Panel>
  );
}

function DisputedOrder({ order }: { order: OrderView }) {
  const timeZone = useGuildTimeZone();
  const dispute = order.dispute;
  if (!dispute) return null;
  return (
    <li className="rounded-stitch border-2 border-ochre bg-ochre-wash p-3">
      <p className="flex flex-wrap items-baseline gap-x-3">
        <Link to={paths.app.order.getHref(order.id)} className="text-lg font-bold">
          Order {order.reference}
        </Link>
        <span>
          {order.seller.name} to {order.buyer.name}
        </span>
        {dispute.amountMinor !== null ? <strong className="tabular-nums">{formatMoney(dispute.amountMinor, order.currency)}</strong> : null}
      </p>
      <p>
        {dispute.reason ? disputeReasonLabel(dispute.reason) : null}
        {dispute.status ? ` · ${disputeStatusLabel(dispute.status)}` : null}
      </p>
      <p className="font-semibold">
        {dispute.evidenceDueBy ? (
          <>
            Evidence due by <time dateTime={dispute.evidenceDueBy}>{formatShortDateTime(dispute.evidenceDueBy, timeZone)}</time>
          </>
        ) : (
          'The bank has not asked for evidence'
        )}
      </p>
    </li>
  );
}
