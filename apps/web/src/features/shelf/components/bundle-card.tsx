import { FIBRE_LABELS, formatWeight, type BundleCard as BundleCardData, type UnitSystem } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { formatOffer, formatYieldLine } from '../../../utils/bundle-text.ts';
import { cardSrcSet } from '../../../utils/photo-sources.ts';

/**
 * The card photo's width in CSS px at each layout of the shelf, in px because the app's root size is 18 px
 * (styles.css) while `sizes` reads rem as 16: main padding 18 px a side, 27 from 640 px; the filters column
 * (324 px + 27 gap) from 768; the menu (270 px) once the shell is 1080 px wide; three cards from 1280; the
 * shell stops growing at 1440; cards 18 px apart inside a 2 px border. Measured in Chromium at 412, 800,
 * 1100 and 1440 px.
 */
export const CARD_PHOTO_SIZES = [
  '(min-width: 1440px) 239px',
  '(min-width: 1280px) calc(33.33vw - 241px)',
  '(min-width: 1080px) calc(50vw - 351px)',
  '(min-width: 768px) calc(50vw - 216px)',
  '(min-width: 640px) calc(50vw - 40px)',
  'calc(100vw - 40px)',
].join(', ');

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
