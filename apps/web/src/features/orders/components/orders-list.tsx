import { formatMoney, type OrderView } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { EmptyWithShelfLink } from '../../../components/empty-with-shelf-link.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { cn } from '../../../utils/cn.ts';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useOrders, type OrderSide } from '../api/get-orders.ts';
import { OrderStatusBadge } from './order-status-badge.tsx';

const SIDES: Record<OrderSide, { label: string; empty: string }> = {
  buyer: { label: 'I bought', empty: 'No orders yet: you have not bought or asked for a bundle from the shelf.' },
  seller: { label: 'I gave or sold', empty: 'No orders yet: nobody has bought or asked for one of your bundles.' },
};

/** A switch between the two sides (a link each, so the choice is in the address and survives a reload). */
export function OrderSideSwitch({ side }: { side: OrderSide }) {
  return (
    <nav aria-label="Which orders" className="inline-flex rounded-stitch border-2 border-thread bg-muslin p-1">
      {(Object.keys(SIDES) as OrderSide[]).map((candidate) => (
        <Link
          key={candidate}
          to={paths.app.orders.getHref(candidate)}
          aria-current={candidate === side ? 'page' : undefined}
          className={cn(
            'inline-flex min-h-11 items-center rounded-stitch px-4 font-semibold no-underline',
            candidate === side ? 'bg-thread text-white hover:text-white' : 'text-thread hover:bg-linen-deep hover:text-thread',
          )}
        >
          {SIDES[candidate].label}
        </Link>
      ))}
    </nav>
  );
}

export interface OrdersListProps {
  side: OrderSide;
  /** A new quilter: starter bundles they claim are not orders, so an empty list says where those are. */
  claimsStarter: boolean;
}

export function OrdersList({ side, claimsStarter }: OrdersListProps) {
  const orders = useOrders(side);
  if (orders.isPending) return <Loading label="Loading your orders…" />;
  if (orders.isError) {
    return (
      <Alert tone="error" title="Your orders could not be loaded">
        <p>{orders.error.message}</p>
        <Button variant="secondary" onClick={() => orders.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  if (orders.data.items.length === 0) {
    const pointToClaims = side === 'buyer' && claimsStarter;
    return (
      <EmptyWithShelfLink
        otherLinks={
          pointToClaims ? (
            <ButtonLink to={paths.app.starter.getHref()} variant="secondary">
              Your starter bundles
            </ButtonLink>
          ) : null
        }
      >
        <p className="text-lg">{SIDES[side].empty}</p>
        {pointToClaims ? <p>Starter bundles you claim are not orders: they are listed on the Starter bundles page.</p> : null}
      </EmptyWithShelfLink>
    );
  }
  return (
    <ul className="space-y-4" aria-label={SIDES[side].label}>
      {orders.data.items.map((order) => (
        <OrderCard key={order.id} order={order} side={side} />
      ))}
    </ul>
  );
}

function OrderCard({ order, side }: { order: OrderView; side: OrderSide }) {
  const timeZone = useGuildTimeZone();
  const thumb = order.items.find((item) => item.thumbUrl)?.thumbUrl ?? null;
  const titles = order.items.map((item) => (item.quantity > 1 ? `${item.title} × ${item.quantity}` : item.title)).join(', ');
  const other = side === 'buyer' ? `From ${order.seller.name}` : `To ${order.buyer.name}`;
  const money =
    side === 'buyer'
      ? order.chargeMinor > 0
        ? `Total ${formatMoney(order.chargeMinor, order.currency)}`
        : 'Nothing to pay'
      : order.sellerCreditMinor !== null && order.sellerCreditMinor > 0
        ? `Your credit ${formatMoney(order.sellerCreditMinor, order.currency)}`
        : 'A gift';
  return (
    <li className="flex gap-4 rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt">
      {thumb ? (
        <img src={thumb} alt={`Photo of “${order.items[0]?.title ?? 'the bundle'}”`} width={80} height={80} className="size-20 shrink-0 rounded-stitch border border-seam object-cover" />
      ) : (
        <span aria-hidden="true" className="size-20 shrink-0 rounded-stitch border border-seam bg-linen-deep" />
      )}
      <div className="min-w-0 flex-1 space-y-1">
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <h2 className="text-lg font-bold">
            <Link to={paths.app.order.getHref(order.id)}>Order {order.reference}</Link>
          </h2>
          <OrderStatusBadge state={order.state} />
        </div>
        <p className="[overflow-wrap:anywhere]">{titles}</p>
        <p className="text-thread-soft">
          {formatDate(order.createdAt, timeZone)} · {other} · {order.fulfilment === 'post' ? 'By post' : 'At a meeting'} · {money}
        </p>
        {order.abilities.pay ? <p className="font-semibold text-ochre">Waiting for your payment</p> : null}
        {order.abilities.markPosted ? <p className="font-semibold text-madder-deep">Paid: ready to post</p> : null}
        {order.abilities.markReceived ? <p className="font-semibold text-madder-deep">Posted: mark it received when it arrives</p> : null}
      </div>
    </li>
  );
}
