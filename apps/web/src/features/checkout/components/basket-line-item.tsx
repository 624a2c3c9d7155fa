import { formatMoney, formatWeight, OFFER_LABELS, type UnitSystem } from '@scrap-relay/shared';
import { useId, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/field.tsx';
import { MAX_BASKET_QUANTITY } from '../../../lib/basket-store.ts';
import type { BasketLine } from '../utils/basket-lines.ts';

export interface BasketLineItemProps {
  line: BasketLine;
  units: UnitSystem;
  onQuantityChange?: (quantity: number) => void;
  onRemove: () => void;
  /** Why this line is set aside (held by someone else, cannot travel the chosen way). */
  note?: ReactNode;
  disabled?: boolean;
}

/** One bundle in the basket: photo, title, offer, weight, price, how many, and a way to take it out. */
export function BasketLineItem({ line, units, onQuantityChange, onRemove, note, disabled }: BasketLineItemProps) {
  const { bundle } = line;
  const quantityId = useId();
  const thumb = bundle.photos[0]?.thumbUrl ?? null;
  const most = Math.min(bundle.quantityAvailable, MAX_BASKET_QUANTITY);
  const price =
    bundle.offer === 'sale' && bundle.priceMinor !== null
      ? `${formatMoney(bundle.priceMinor, bundle.currency)}${bundle.quantity > 1 ? ' each' : ''}`
      : 'Free';
  return (
    <li className="flex gap-3 border-b border-seam py-3 last:border-b-0 sm:gap-4">
      {thumb ? (
        <img src={thumb} alt={`Photo of “${bundle.title}”`} width={80} height={80} className="size-20 shrink-0 rounded-stitch border border-seam object-cover" />
      ) : (
        <span aria-hidden="true" className="size-20 shrink-0 rounded-stitch border border-seam bg-linen-deep" />
      )}
      <div className="min-w-0 flex-1 space-y-1">
        <Link to={paths.app.bundle.getHref(bundle.id)} className="font-semibold">
          {bundle.title}
        </Link>
        <p className="text-thread-soft">
          {bundle.offer ? OFFER_LABELS[bundle.offer] : null}
          {bundle.weightGrams ? ` · ${formatWeight(bundle.weightGrams, units)}` : null}
          {` · ${price}`}
        </p>
        {note ? <div className="text-thread-soft">{note}</div> : null}
        <div className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 pt-1">
          {onQuantityChange && most > 1 ? (
            <div className="flex items-center gap-2">
              <label htmlFor={quantityId} className="whitespace-nowrap font-semibold">
                How many
              </label>
              <Select
                id={quantityId}
                className="w-20"
                value={String(line.quantity)}
                disabled={disabled}
                aria-describedby={`${quantityId}-left`}
                options={Array.from({ length: most }, (_, i) => ({ value: String(i + 1), label: String(i + 1) }))}
                onChange={(event) => onQuantityChange(Number(event.target.value))}
              />
              <span id={`${quantityId}-left`} className="whitespace-nowrap text-thread-soft">
                of {bundle.quantityAvailable}
              </span>
            </div>
          ) : line.quantity > 1 ? (
            <p>{line.quantity} packs</p>
          ) : (
            <span />
          )}
          <Button variant="quiet" className="ml-auto" onClick={onRemove} disabled={disabled}>
            Remove<span className="sr-only"> “{bundle.title}” from your basket</span>
          </Button>
        </div>
      </div>
    </li>
  );
}
