import { CARD_PHOTO_SIZES, cardSrcSet, FIBRE_LABELS, formatWeight, type BundleCard as BundleCardData, type UnitSystem } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { formatOffer, formatYieldLine } from '../../../utils/bundle-text.ts';

/**
 * How a card's photo loads: the first row is wanted at once (the first photo is usually the page's
 * largest paint), the rest when scrolled near.
 */
export type CardPhotoLoading = 'first' | 'eager' | 'lazy';

/**
 * One bundle on the shelf. The title is the link; it stretches over the whole card so
 * the photo is a target too.
 */
export function BundleCard({ bundle, units, photoLoading = 'lazy' }: { bundle: BundleCardData; units: UnitSystem; photoLoading?: CardPhotoLoading }) {
  const srcSet = cardSrcSet(bundle);
  return (
    <li className="relative flex flex-col overflow-hidden rounded-stitch border-2 border-seam bg-muslin shadow-quilt hover:border-selvage">
      <div className="aspect-[4/3] bg-linen-deep">
        {bundle.thumbUrl ? (
          <img
            src={bundle.thumbUrl}
            srcSet={srcSet}
            sizes={srcSet ? CARD_PHOTO_SIZES : undefined}
            // The box is 4:3 whatever the photo; these keep its place before the file arrives.
            width={400}
            height={300}
            alt={`Photo: ${bundle.title}`}
            loading={photoLoading === 'lazy' ? 'lazy' : 'eager'}
            fetchPriority={photoLoading === 'first' ? 'high' : undefined}
            decoding={photoLoading === 'first' ? undefined : 'async'}
            className="size-full object-cover"
          />
        ) : (
          <p className="flex size-full items-center justify-center text-thread-soft">No photo</p>
        )}
      </div>
      <div className="flex flex-1 flex-col gap-1 p-4">
        <h3 className="text-lg font-bold">
          <Link to={paths.app.bundle.getHref(bundle.id)} className="text-thread no-underline after:absolute after:inset-0 hover:underline">
            {bundle.title}
          </Link>
        </h3>
        <p className="text-xl font-bold text-madder-deep">
          {formatOffer(bundle.offer, bundle.priceMinor, bundle.currency)}
          {bundle.offer === 'sale' && bundle.meetingHandoverOk ? (
            <span className="block text-base font-semibold text-thread-soft">or collect at a meeting</span>
          ) : null}
        </p>
        <p>
          {formatWeight(bundle.weightGrams, units)} · {FIBRE_LABELS[bundle.fibre]}
        </p>
        <p className="text-thread-soft">{formatYieldLine(bundle.yield)}</p>
        {bundle.quantityAvailable > 1 ? <p className="font-semibold">{bundle.quantityAvailable} packs available</p> : null}
      </div>
    </li>
  );
}
