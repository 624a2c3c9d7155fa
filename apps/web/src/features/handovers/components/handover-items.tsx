import type { HandoverView } from '@scrap-relay/shared';

/** The bundles in one handover, each with its thumbnail, so the right bag is picked from the pile. */
export function HandoverItems({ items, size = 'regular' }: { items: HandoverView['items']; size?: 'regular' | 'print' }) {
  const thumb = size === 'print' ? 'size-[18mm]' : 'size-16';
  return (
    <ul className="space-y-2">
      {items.map((item, index) => (
        <li key={`${item.title}-${index}`} className="flex items-center gap-3">
          {item.thumbUrl ? (
            <img src={item.thumbUrl} alt="" className={`${thumb} shrink-0 rounded-stitch border border-seam object-cover`} />
          ) : (
            <span aria-hidden="true" className={`${thumb} shrink-0 rounded-stitch border border-dashed border-selvage`} />
          )}
          <span>
            {item.title}
            {item.quantity > 1 ? <span className="font-semibold"> × {item.quantity}</span> : null}
          </span>
        </li>
      ))}
    </ul>
  );
}

/** "Order SR-0042", or the starter claim's own reference ("Starter 47296E89"), which already names its kind. */
export const handoverName = (handover: Pick<HandoverView, 'kind' | 'reference'>): string =>
  handover.kind === 'starter' ? handover.reference : `Order ${handover.reference}`;
