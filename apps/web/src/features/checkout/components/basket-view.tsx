import type { UnitSystem } from '@scrap-relay/shared';
import { useQueries, useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { EmptyWithShelfLink } from '../../../components/empty-with-shelf-link.tsx';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { isApiError } from '../../../lib/api-client.ts';
import { basketQueryKey, useBasket, useBasketChanges } from '../../../lib/basket-store.ts';
import { useMeetings } from '../../../lib/meetings.ts';
import { basketBundleQueryKey, getBundleQueryOptions } from '../api/get-bundle.ts';
import { useMyAddress } from '../../../lib/my-address.ts';
import type { PlacedOrder } from '../api/place-order.ts';
import { groupBySeller, reviewBasket, type BasketRemoval, type BundleLookup } from '../utils/basket-lines.ts';
import { basketCharges } from '../utils/charges.ts';
import { BasketLineItem } from './basket-line-item.tsx';
import { MerchantNotes } from './merchant-notes.tsx';
import { SellerCheckout } from './seller-checkout.tsx';

export interface BasketMember {
  id: string;
  units: UnitSystem;
  emailVerified: boolean;
}

export interface BasketViewProps {
  member: BasketMember;
  guild: { name: string; currency: string };
  /** Just added from a bundle page: named at the top once it has loaded. */
  addedBundleId?: string | null;
  /** Why the bundle a link asked to add could not go in the basket, in the server's words. */
  notAdded?: string | null;
}

const NO_ITEMS: readonly { bundleId: string; quantity: number }[] = [];

/**
 * The basket: re-checked against the shelf on every visit (what is gone is taken
 * out, with the reason), grouped by seller, each group checking out as one order.
 */
export function BasketView({ member, guild, addedBundleId, notAdded }: BasketViewProps) {
  const basket = useBasket(member.id);
  const items = basket.data?.items ?? NO_ITEMS;
  const changes = useBasketChanges(member.id);
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const [removed, setRemoved] = useState<BasketRemoval[]>([]);
  const [reduced, setReduced] = useState<Array<{ bundleId: string; title: string; quantity: number }>>([]);
  const [placed, setPlaced] = useState<PlacedOrder | null>(null);
  const address = useMyAddress();
  const meetingsQuery = useMeetings('upcoming');

  const results = useQueries({ queries: items.map((item) => getBundleQueryOptions(item.bundleId)) });
  const lookups = useMemo(() => {
    const map = new Map<string, BundleLookup>();
    items.forEach((item, index) => {
      const result = results[index];
      if (!result || result.isPending) map.set(item.bundleId, { status: 'pending' });
      else if (result.isError) {
        const gone = isApiError(result.error) && (result.error.status === 404 || result.error.status === 403);
        map.set(item.bundleId, { status: gone ? 'gone' : 'failed' });
      } else map.set(item.bundleId, { status: 'found', bundle: result.data.bundle });
    });
    return map;
  }, [items, results]);
  const review = useMemo(() => reviewBasket(items, lookups, member.id), [items, lookups, member.id]);

  // Take out what is gone and lower what has fewer copies left, keeping a note of each for the member. Each is
  // asked of the server once per visit: one it refuses stays in the basket (and is refused again at checkout).
  const tidied = useRef(new Set<string>());
  useEffect(() => {
    const removals = review.removals.filter((removal) => !tidied.current.has(removal.bundleId));
    const reductions = review.reductions.filter((reduction) => !tidied.current.has(`${reduction.bundleId}:${reduction.quantity}`));
    if (removals.length === 0 && reductions.length === 0) return;
    for (const removal of removals) {
      tidied.current.add(removal.bundleId);
      changes.remove.mutate(removal.bundleId);
    }
    for (const reduction of reductions) {
      tidied.current.add(`${reduction.bundleId}:${reduction.quantity}`);
      changes.setQuantity.mutate({ bundleId: reduction.bundleId, quantity: reduction.quantity });
    }
    const byId = <T extends { bundleId: string }>(older: T[], newer: T[]) => [
      ...older.filter((old) => !newer.some((entry) => entry.bundleId === old.bundleId)),
      ...newer,
    ];
    if (removals.length > 0) setRemoved((older) => byId(older, removals));
    if (reductions.length > 0) setReduced((older) => byId(older, reductions));
    // The review alone decides when this runs: the mutation objects change with every state they pass through.
  }, [review]);

  // An order is placed: card payments continue on the payment page, a free handover is already confirmed.
  useEffect(() => {
    if (!placed) return;
    if (placed.checkoutUrl) window.location.assign(placed.checkoutUrl);
    else navigate(paths.app.order.getHref(placed.order.id));
  }, [placed, navigate]);

  const groups = groupBySeller(review.lines);
  const failed = items.filter((item) => lookups.get(item.bundleId)?.status === 'failed');
  const checking = items.filter((item) => lookups.get(item.bundleId)?.status === 'pending');
  const added = addedBundleId ? review.lines.find((line) => line.bundleId === addedBundleId) : undefined;

  if (placed?.checkoutUrl) {
    return (
      <Alert tone="success" title={`Order ${placed.order.reference} is held for you`}>
        <p>Opening the card payment page…</p>
        <p>
          If it does not open, <a href={placed.checkoutUrl}>go to the payment page</a>.
        </p>
      </Alert>
    );
  }

  const remove = (bundleId: string) => changes.remove.mutate(bundleId);
  const changeQuantity = (bundleId: string, quantity: number) => changes.setQuantity.mutate({ bundleId, quantity });
  const recheck = (bundleIds: string[]) => {
    for (const bundleId of bundleIds) void queryClient.invalidateQueries({ queryKey: basketBundleQueryKey(bundleId) });
  };

  if (basket.isPending) return <Loading label="Opening your basket…" />;
  if (basket.isError) {
    return (
      <Alert tone="error" title="Your basket could not be opened">
        <p>Scrap Relay did not answer. Your basket is kept; try again in a moment.</p>
        <Button variant="secondary" onClick={() => void basket.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }

  return (
    <div className="space-y-6">
      {added ? <Alert tone="success" title={`“${added.bundle.title}” is in your basket`} /> : null}
      {notAdded ? <Alert tone="warning" title="That bundle is not in your basket">{notAdded}</Alert> : null}
      {changes.add.isError || changes.remove.isError || changes.setQuantity.isError ? (
        <Alert tone="error" title="Your basket could not be changed">
          <p>Scrap Relay did not take the change; your basket shows what it holds.</p>
        </Alert>
      ) : null}

      {removed.length > 0 || reduced.length > 0 ? (
        <Alert tone="warning" title="Your basket changed since you last looked">
          <ul className="list-disc space-y-1 pl-5">
            {removed.map((removal) => (
              <li key={removal.bundleId}>
                {removal.title ? `“${removal.title}”` : 'A bundle'} {removal.reason} It has been taken out of your basket.
              </li>
            ))}
            {reduced.map((reduction) => (
              <li key={reduction.bundleId}>
                Only {reduction.quantity} {reduction.quantity === 1 ? 'pack' : 'packs'} of “{reduction.title}” {reduction.quantity === 1 ? 'is' : 'are'}{' '}
                left, so your basket now asks for {reduction.quantity}.
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}

      {!member.emailVerified ? (
        <Alert tone="warning" title="Confirm your e-mail address to check out" announce={false}>
          <p>Use the link in the message we sent you. You can fill your basket meanwhile.</p>
        </Alert>
      ) : null}

      {items.length === 0 ? (
        <EmptyWithShelfLink>
          <p className="text-lg">Your basket is empty.</p>
          <p>Add bundles from their pages on the shelf; they wait here, on every device you sign in on, until you check out. Nothing is held for you until then.</p>
        </EmptyWithShelfLink>
      ) : null}

      {checking.length > 0 ? <Loading label={`Checking ${checking.length === 1 ? 'a bundle' : `${checking.length} bundles`} with the shelf…`} /> : null}

      {failed.length > 0 ? (
        <Alert tone="error" title="Some bundles could not be checked">
          <p>Scrap Relay did not answer for {failed.length === 1 ? 'one bundle' : `${failed.length} bundles`}. They stay in your basket.</p>
          <Button variant="secondary" onClick={() => recheck(failed.map((item) => item.bundleId))}>
            Try again
          </Button>
        </Alert>
      ) : null}

      {groups.length > 1 ? (
        <p className="text-lg">
          Your basket holds bundles from {groups.length} members. Each member’s bundles check out as one order, with their own postage.
        </p>
      ) : null}

      {groups.length > 0 && address.isPending ? <Loading label="Loading your saved address…" /> : null}
      {groups.length > 0 && !address.isPending
        ? groups.map((group) => (
            <SellerCheckout
              key={group.seller.id}
              group={group}
              units={member.units}
              guildCurrency={guild.currency}
              savedAddress={address.data?.address ?? null}
              meetings={{
                status: meetingsQuery.status,
                items: meetingsQuery.data?.items ?? [],
                retry: () => void meetingsQuery.refetch(),
              }}
              canOrder={member.emailVerified}
              onQuantityChange={changeQuantity}
              onRemove={remove}
              onPlaced={(order) => {
                // The order took its bundles out of the basket on the server; the next read shows it.
                void queryClient.invalidateQueries({ queryKey: basketQueryKey(member.id) });
                setPlaced(order);
              }}
              onConflict={recheck}
            />
          ))
        : null}

      {review.waiting.length > 0 ? (
        <Panel title="Waiting for someone else’s payment">
          <p>
            Another member is paying for {review.waiting.length === 1 ? 'this bundle' : 'these bundles'} now. If they do not finish in time, it goes
            back on the shelf and you can check it out here.
          </p>
          <ul>
            {review.waiting.map((line) => (
              <BasketLineItem key={line.bundleId} line={line} units={member.units} onRemove={() => remove(line.bundleId)} />
            ))}
          </ul>
        </Panel>
      ) : null}

      {items.length > 0 ? <MerchantNotes guildName={guild.name} charges={basketCharges([...review.lines, ...review.waiting])} /> : null}
    </div>
  );
}
