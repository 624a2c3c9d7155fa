import { describeShelfFilters, parseShelfFilters, shelfSearchParams, type UnitSystem, type WishView } from '@scrap-relay/shared';
import { useId, useState } from 'react';
import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useWishes } from '../api/get-wishes.ts';
import { useDeleteWish } from '../api/delete-wish.ts';

export interface WishesListProps {
  units: UnitSystem;
  currency: string;
}

/** The member's wishes in words, each with the way back to the shelf and a delete. */
export function WishesList({ units, currency }: WishesListProps) {
  const wishes = useWishes();
  const [deleting, setDeleting] = useState<WishView | null>(null);
  const [deleted, setDeleted] = useState<string | null>(null);
  const headingId = useId();
  const timeZone = useGuildTimeZone();

  if (wishes.isPending) return <Loading label="Loading your wishes…" />;
  if (wishes.isError) {
    return (
      <Alert tone="error" title="Your wishes could not be loaded">
        <p>{wishes.error.message}</p>
        <Button variant="secondary" onClick={() => wishes.refetch()} isPending={wishes.isFetching} pendingLabel="Trying…">
          Try again
        </Button>
      </Alert>
    );
  }

  const items = wishes.data.items;
  return (
    <section aria-labelledby={headingId} className="space-y-4">
      <h2 id={headingId} className="text-2xl font-bold">
        {items.length === 0 ? 'Your wishes' : `Your wishes (${items.length})`}
      </h2>
      {deleted ? <Alert tone="success" title={`Deleted the wish “${deleted}”.`} /> : null}
      {items.length === 0 ? (
        <div className="space-y-3 rounded-stitch border-2 border-dashed border-seam p-6">
          <p>You have no wishes yet. Filter the shelf for what you are after, then choose “Save these filters as a wish”.</p>
          <ButtonLink to={paths.app.shelf.getHref()} variant="secondary">
            Go to the shelf
          </ButtonLink>
        </div>
      ) : (
        <ul className="space-y-4">
          {items.map((wish) => {
            const filters = parseShelfFilters((key) => wish.filters[key]);
            return (
              <li key={wish.id} className="space-y-3 rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt sm:p-5">
                <div>
                  <h3 className="text-xl font-bold">{wish.name}</h3>
                  <p className="text-lg">{describeShelfFilters(filters, { units, currency })}</p>
                  <p className="text-thread-soft">Saved on {formatDate(wish.createdAt, timeZone)}</p>
                </div>
                <div className="flex flex-wrap gap-3">
                  <ButtonLink to={paths.app.shelf.getHref(shelfSearchParams({ filters }).toString())} variant="secondary">
                    Show on the shelf<span className="sr-only">: {wish.name}</span>
                  </ButtonLink>
                  <Button variant="quiet" onClick={() => setDeleting(wish)}>
                    Delete<span className="sr-only"> the wish {wish.name}</span>
                  </Button>
                </div>
              </li>
            );
          })}
        </ul>
      )}
      {deleting ? (
        <DeleteWishDialog
          wish={deleting}
          onClose={() => setDeleting(null)}
          onDeleted={(name) => {
            setDeleting(null);
            setDeleted(name);
          }}
        />
      ) : null}
    </section>
  );
}

function DeleteWishDialog({ wish, onClose, onDeleted }: { wish: WishView; onClose: () => void; onDeleted: (name: string) => void }) {
  const remove = useDeleteWish({ onSuccess: () => onDeleted(wish.name) });
  return (
    <ConfirmDialog
      open
      title={`Delete the wish “${wish.name}”?`}
      confirmLabel="Delete wish"
      pendingLabel="Deleting…"
      confirmVariant="danger"
      isPending={remove.isPending}
      onCancel={onClose}
      onConfirm={() => remove.mutate(wish.id)}
    >
      <p>You will no longer get an e-mail when a bundle like this is approved. Bundles already on the shelf stay there.</p>
      {remove.isError ? (
        <p role="alert" className="font-semibold text-madder-deep">
          {remove.error.message}
        </p>
      ) : null}
    </ConfirmDialog>
  );
}
