import {
  BUNDLE_STATE_LABELS,
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUE_LABELS,
  CUT_KIND_LABELS,
  FIBRE_LABELS,
  formatLength,
  formatWeight,
  OFFER_LABELS,
  STANDARD_CUT_LABELS,
  STANDARD_CUTS,
  type BundleView,
  type PhotoView,
  type UnitSystem,
  type YieldEstimate,
} from '@scrap-relay/shared';
import type { ReactNode } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { ColourSwatch, colourWords } from '../../../components/colour-swatch.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { formatOffer } from '../../../utils/bundle-text.ts';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { photoSrcSet } from '../../../utils/photo-sources.ts';
import { formatCount, yieldFacts } from '../../../utils/yield-text.ts';
import { formatWaitingTime } from '../utils/waiting-time.ts';
import { Disclosures } from './disclosures.tsx';
import { ReviewDecisionForm, type ReviewOutcome } from './review-decision-form.tsx';

const PHOTO_SIZES = '(min-width: 64rem) 40rem, 92vw';

export interface BundleReviewProps {
  bundle: BundleView;
  units: UnitSystem;
  onDecided: (outcome: ReviewOutcome) => void;
}

/** Everything the librarian checks before a bundle goes on the shelf, and the decision. */
export function BundleReview({ bundle, units, onDecided }: BundleReviewProps) {
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start">
      <Photos title={bundle.title} photos={bundle.photos} />
      {/* The decision comes after the facts, in reading order as in the review itself: look, then decide. */}
      <div className="space-y-6">
        <Panel title="Offer">
          <p className="text-2xl font-bold text-madder-deep">{bundle.offer ? formatOffer(bundle.offer, bundle.priceMinor, bundle.currency) : 'No offer chosen'}</p>
          {bundle.offer ? <p>{OFFER_LABELS[bundle.offer]}</p> : null}
          {bundle.offer === 'sale' && bundle.meetingHandoverOk ? <p>The buyer may also collect it at a meeting.</p> : null}
          {bundle.quantity > 1 ? <p>{bundle.quantity} identical packs.</p> : null}
        </Panel>
        <Contents bundle={bundle} units={units} />
        {bundle.yield ? <YieldPanel estimate={bundle.yield} cutPlan={bundle.cutPlan} units={units} /> : null}
        <Panel title="Disclosures">
          <Disclosures {...bundle.disclosures} />
        </Panel>
        <SellerPanel bundle={bundle} />
        <Decision bundle={bundle} onDecided={onDecided} />
      </div>
    </div>
  );
}

function Decision({ bundle, onDecided }: { bundle: BundleView; onDecided: (outcome: ReviewOutcome) => void }) {
  if (bundle.state !== 'in_review') {
    return (
      <Alert tone="info" title="This bundle is not waiting for review" announce={false}>
        <p>It is now: {BUNDLE_STATE_LABELS[bundle.state]}.</p>
      </Alert>
    );
  }
  if (!bundle.abilities.review) {
    return (
      <Alert tone="warning" title="Another librarian must review this bundle" announce={false}>
        <p>You listed it yourself, so a second pair of eyes decides. It stays in the queue for them.</p>
      </Alert>
    );
  }
  return (
    <Panel title="Your decision">
      <ReviewDecisionForm bundleId={bundle.id} title={bundle.title} offer={bundle.offer} onDecided={onDecided} />
    </Panel>
  );
}

function Photos({ title, photos }: { title: string; photos: PhotoView[] }) {
  if (photos.length === 0) return <Alert tone="warning" title="No photos" announce={false} />;
  return (
    // Beside the facts on wide screens, the photos stay in view while the librarian reads down and decides.
    <section aria-label="Photos" className="space-y-4 lg:sticky lg:top-4">
      {photos.map((photo, index) => (
        <figure key={photo.id} className="space-y-1">
          <a href={photo.url} target="_blank" rel="noreferrer" className="block">
            <img
              src={photo.url}
              srcSet={photoSrcSet(photo)}
              sizes={PHOTO_SIZES}
              width={photo.width}
              height={photo.height}
              alt={`Photo ${index + 1} of ${photos.length}: ${title}`}
              loading={index === 0 ? 'eager' : 'lazy'}
              decoding="async"
              className="h-auto w-full rounded-stitch border-2 border-seam bg-linen-deep"
            />
            <span className="sr-only"> (opens full size in a new tab)</span>
          </a>
          <figcaption className="flex items-center gap-2 text-thread-soft">
            Photo {index + 1} of {photos.length} ·
            <ColourSwatch hex={photo.averageHex} of="average colour of the photo" />
            {/* The swatch's name says the same to screen readers. */}
            <span aria-hidden="true">average colour: {colourWords(photo.averageHex)}</span>
          </figcaption>
        </figure>
      ))}
    </section>
  );
}

function Facts({ children }: { children: ReactNode }) {
  return <dl className="grid gap-x-4 sm:grid-cols-[10rem_1fr] sm:gap-y-2 max-sm:[&>dd]:mb-2">{children}</dl>;
}

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <>
      <dt className="font-semibold text-thread-soft">{term}</dt>
      <dd>{children}</dd>
    </>
  );
}

function Contents({ bundle, units }: { bundle: BundleView; units: UnitSystem }) {
  const { colour } = bundle;
  return (
    <Panel title="Contents">
      {bundle.description ? <p className="whitespace-pre-line">{bundle.description}</p> : null}
      <Facts>
        <Fact term="Weight">{bundle.weightGrams === null ? 'Not given' : formatWeight(bundle.weightGrams, units)}{bundle.quantity > 1 ? ' per pack' : ''}</Fact>
        <Fact term="Fibre">{bundle.fibre ? FIBRE_LABELS[bundle.fibre] : 'Not given'}</Fact>
        <Fact term="Cuts">{bundle.cutKinds.length > 0 ? bundle.cutKinds.map((cut) => CUT_KIND_LABELS[cut]).join(', ') : 'Not given'}</Fact>
        <Fact term="Colour value">{colour.value ? COLOUR_VALUE_LABELS[colour.value] : 'Not given'}</Fact>
        <Fact term="Colour family">{colour.family ? COLOUR_FAMILY_LABELS[colour.family] : 'Not given'}</Fact>
        {colour.suggested ? (
          <Fact term="Photos suggest">
            <span className="inline-flex items-center gap-2">
              <span aria-hidden="true" className="inline-block size-5 rounded border border-selvage" style={{ backgroundColor: colour.suggested.hex }} />
              {COLOUR_VALUE_LABELS[colour.suggested.value]}, {COLOUR_FAMILY_LABELS[colour.suggested.family].toLowerCase()}
            </span>
          </Fact>
        ) : null}
        <Fact term="Prewashed">{bundle.prewashed ? 'Yes' : 'No'}</Fact>
      </Facts>
      {bundle.pieces.length > 0 ? (
        <table className="w-full border-collapse">
          <caption className="text-left font-bold">Pieces listed by the seller</caption>
          <thead>
            <tr className="border-b-2 border-thread text-left">
              <th scope="col" className="py-1 pr-3">Width</th>
              <th scope="col" className="py-1 pr-3">Height</th>
              <th scope="col" className="py-1">How many</th>
            </tr>
          </thead>
          <tbody>
            {bundle.pieces.map((piece, index) => (
              <tr key={index} className="border-b border-seam">
                <td className="py-1 pr-3">{formatLength(piece.widthMm, units)}</td>
                <td className="py-1 pr-3">{formatLength(piece.heightMm, units)}</td>
                <td className="py-1">{formatCount(piece.count)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
    </Panel>
  );
}

/** The same figures, worded and rounded the same, as the bundle page shows members (utils/yield-text.ts). */
function YieldPanel({ estimate, cutPlan, units }: { estimate: YieldEstimate; cutPlan: BundleView['cutPlan']; units: UnitSystem }) {
  return (
    <Panel title="Yield estimate">
      <p className="text-thread-soft">
        From the weight and fibre ({estimate.gsm} g/m²), allowing {Math.round(estimate.waste * 100)} % for odd shapes and trimmings. Equivalents,
        not a promise that every piece is big enough.
      </p>
      <Facts>
        {yieldFacts(estimate, units).map(({ label, value }) => (
          <Fact key={label} term={label}>
            {value}
          </Fact>
        ))}
      </Facts>
      {cutPlan ? (
        <>
          <h3 className="font-bold">From the listed pieces (cut plan)</h3>
          <Facts>
            {STANDARD_CUTS.map((cut) => (
              <Fact key={cut} term={STANDARD_CUT_LABELS[cut]}>
                {formatCount(cutPlan.totals[cut])}
              </Fact>
            ))}
          </Facts>
        </>
      ) : null}
    </Panel>
  );
}

function SellerPanel({ bundle }: { bundle: BundleView }) {
  const { seller } = bundle;
  const timeZone = useGuildTimeZone();
  return (
    <Panel title="The seller’s history">
      <p>
        <strong>{seller.firstName}</strong> has rehomed {seller.rehomedCount === 1 ? '1 bundle' : `${seller.rehomedCount} bundles`}; {seller.returnedCount === 1 ? '1 listing was' : `${seller.returnedCount} listings were`} returned from review before.
      </p>
      {bundle.submittedAt ? (
        <p>
          Sent for review on {formatDate(bundle.submittedAt, timeZone)} (waiting {formatWaitingTime(bundle.submittedAt)}).
        </p>
      ) : null}
      {bundle.reviewNotes ? (
        <div>
          <h3 className="font-bold">Notes from the last review</h3>
          <p className="whitespace-pre-line">{bundle.reviewNotes}</p>
        </div>
      ) : null}
    </Panel>
  );
}
