import {
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUE_LABELS,
  CUT_KIND_LABELS,
  FIBRE_LABELS,
  formatWeight,
  type BundleView,
  type UnitSystem,
} from '@scrap-relay/shared';
import { photoSrcSet } from '../../../utils/photo-sources.ts';

/** "Fat quarters, Strips (by width)" — the cut kinds as the listing form names them. */
export const cutKindsText = (bundle: Pick<BundleView, 'cutKinds'>): string => bundle.cutKinds.map((kind) => CUT_KIND_LABELS[kind]).join(', ');

/** What a starter bundle holds and is likely to make, in the member's units. */
export function BundleContents({ bundle, units }: { bundle: BundleView; units: UnitSystem }) {
  const colour = [bundle.colour.value ? COLOUR_VALUE_LABELS[bundle.colour.value] : null, bundle.colour.family ? COLOUR_FAMILY_LABELS[bundle.colour.family] : null]
    .filter(Boolean)
    .join(', ');
  const rows: Array<[string, string]> = [
    ['Contents', cutKindsText(bundle) || 'Not described'],
    ['Fibre', bundle.fibre ? FIBRE_LABELS[bundle.fibre] : 'Not given'],
    ['Weight', bundle.weightGrams !== null ? formatWeight(bundle.weightGrams, units) : 'Not given'],
  ];
  if (colour) rows.push(['Colour', colour]);
  rows.push(['Prewashed', bundle.prewashed ? 'Yes' : 'No']);
  // Allergies: say plainly when pets live where the fabric was kept.
  rows.push([
    'Home',
    `${bundle.disclosures.smokeFree ? 'Smoke-free' : 'Not declared smoke-free'}; ${bundle.disclosures.petFree ? 'pet-free' : 'pets live there'}`,
  ]);

  return (
    <div className="space-y-3">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        {rows.map(([term, detail]) => (
          <div key={term} className="contents">
            <dt className="font-semibold text-thread-soft">{term}</dt>
            <dd>{detail}</dd>
          </div>
        ))}
      </dl>
      {bundle.yield ? (
        <p>
          <span className="font-semibold">Likely to make:</span> about {bundle.yield.stripEquivalents} width-of-fabric 2½-inch strips, or{' '}
          {bundle.yield.fiveInchSquares} 5-inch squares.
        </p>
      ) : null}
    </div>
  );
}

/**
 * Starter pages put the photo in one column of two from 640 px (inside a panel, beside the menu from 1080 px),
 * so these slot widths are upper bounds: the browser may fetch one size larger than it needs, never a blurry one.
 */
const STARTER_PHOTO_SIZES = '(min-width: 1080px) 40vw, (min-width: 640px) 50vw, 100vw';

/** The bundle's first photo (every stored size, the browser picks), or a plain panel saying there is none. */
export function BundlePhoto({ bundle, large = false }: { bundle: BundleView; large?: boolean }) {
  const photo = bundle.photos[0];
  if (!photo) {
    return <div className="flex aspect-[4/3] items-center justify-center rounded-stitch bg-linen-deep text-thread-soft">No photo</div>;
  }
  return (
    <img
      src={large ? photo.url : photo.thumbUrl}
      srcSet={photoSrcSet(photo)}
      sizes={STARTER_PHOTO_SIZES}
      alt={`Photo of the starter bundle “${bundle.title}”`}
      width={photo.width}
      height={photo.height}
      loading="lazy"
      className="aspect-[4/3] w-full rounded-stitch object-cover"
    />
  );
}
