import {
  COLOUR_FAMILY_LABELS,
  COLOUR_VALUE_LABELS,
  CUT_KIND_LABELS,
  cutSizesText,
  FIBRE_LABELS,
  formatWeight,
  type BundleView,
  type UnitSystem,
} from '@scrap-relay/shared';
import type { ReactNode } from 'react';
import { paths } from '../../../config/paths.ts';
import { Panel } from '../../../components/layouts/page.tsx';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { offerSummary, rehomedHistory } from '../utils/bundle-text.ts';
import { pieceSize } from '../utils/cut-plan-text.ts';
import { BundleGallery } from './bundle-gallery.tsx';
import { BundleStateLabel } from './bundle-state-label.tsx';
import { CutPlanPictures } from './cut-plan-pictures.tsx';
import { ReviewNotes } from './review-notes.tsx';
import { SellerActions } from './seller-actions.tsx';
import { YieldEstimateView } from './yield-estimate.tsx';

export interface BundleDetailsProps {
  bundle: BundleView;
  units: UnitSystem;
  viewerId: string;
  /**
   * The shopper's action slot. By default it shows what the bundle's abilities
   * allow: "Add to basket" (abilities.buy) or "Claim" through the starter
   * programme (abilities.claim). The checkout and starter features may pass
   * their own control here instead.
   */
  shopperActions?: ReactNode;
}

/** The bundle page: gallery, the facts, yield estimate and cut plan, the seller, and what the viewer may do. */
export function BundleDetails({ bundle, units, viewerId, shopperActions }: BundleDetailsProps) {
  const timeZone = useGuildTimeZone();
  const isSeller = bundle.seller.id === viewerId;
  const facts: Array<[string, ReactNode]> = [
    ['Offer', offerSummary(bundle)],
    ...(bundle.offer === 'sale' ? ([['Handover', bundle.meetingHandoverOk ? 'By post, or collected at a guild meeting' : 'By post']] as Array<[string, ReactNode]>) : []),
    ['Weight', bundle.weightGrams ? `${formatWeight(bundle.weightGrams, units)}${bundle.quantity > 1 ? ' per pack' : ''}` : 'Not given'],
    ...(bundle.quantity > 1 ? ([['Packs', `${bundle.quantityAvailable} of ${bundle.quantity} left`]] as Array<[string, ReactNode]>) : []),
    ['State', <BundleStateLabel key="state" state={bundle.state} offer={bundle.offer} />],
  ];
  // Starter bundles never go on the shelf: they are offered to new quilters from the day they are approved.
  if (bundle.onShelfAt) facts.push([bundle.offer === 'starter' ? 'Offered to new quilters since' : 'On the shelf since', formatDate(bundle.onShelfAt, timeZone)]);

  return (
    <div className="space-y-6">
      {isSeller && bundle.state === 'returned' && bundle.reviewNotes ? <ReviewNotes notes={bundle.reviewNotes} /> : null}
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <BundleGallery photos={bundle.photos} title={bundle.title} />
        <div className="space-y-5">
          <Facts facts={facts} />
          {isSeller ? (
            <SellerActions bundle={bundle} />
          ) : (
            <div data-slot="shopper-actions" className="flex flex-wrap gap-3">
              {shopperActions ?? <DefaultShopperActions bundle={bundle} />}
            </div>
          )}
          <p className="border-t-2 border-seam pt-4">
            {isSeller ? (
              <>You listed this bundle. You {rehomedHistory(bundle.seller.rehomedCount, 'you')}.</>
            ) : (
              <>
                Listed by <strong>{bundle.seller.firstName}</strong>, who {rehomedHistory(bundle.seller.rehomedCount)}.
              </>
            )}
          </p>
        </div>
      </div>

      <Panel title="Contents">
        {bundle.description ? <p className="max-w-prose whitespace-pre-line">{bundle.description}</p> : null}
        <Facts
          facts={[
            ['Cut kinds', bundle.cutKinds.length ? bundle.cutKinds.map((kind) => CUT_KIND_LABELS[kind]).join(', ') : 'Not given'],
            ...(bundle.cutSizes.length ? ([['Sizes', cutSizesText(bundle.cutSizes)]] as [string, ReactNode][]) : []),
            ['Fibre', bundle.fibre ? FIBRE_LABELS[bundle.fibre] : 'Not given'],
            ['Colour value', bundle.colour.value ? COLOUR_VALUE_LABELS[bundle.colour.value] : 'Not given'],
            ['Colour family', bundle.colour.family ? COLOUR_FAMILY_LABELS[bundle.colour.family] : 'Not given'],
            ['Prewashed', bundle.prewashed ? 'Yes' : 'No'],
            ...(bundle.pieces.length
              ? ([
                  [
                    'Listed pieces',
                    <ul key="pieces">
                      {bundle.pieces.map((piece, index) => (
                        <li key={index}>
                          {piece.count} × {pieceSize(piece, units)}
                        </li>
                      ))}
                    </ul>,
                  ],
                ] as Array<[string, ReactNode]>)
              : []),
          ]}
        />
      </Panel>

      <Panel title="From the seller’s home">
        <ul className="space-y-2">
          <Disclosure ok={bundle.disclosures.smokeFree} yes="Smoke-free home" no="Not from a smoke-free home" />
          <Disclosure ok={bundle.disclosures.petFree} yes="Pet-free home" no="Pets live in the home (think of allergies)" />
        </ul>
      </Panel>

      {bundle.yield ? <YieldEstimateView estimate={bundle.yield} units={units} fibre={bundle.fibre} headingLevel={2} /> : null}
      {bundle.cutPlan ? <CutPlanPictures plan={bundle.cutPlan} units={units} headingLevel={2} /> : null}
    </div>
  );
}

/** The default shopper slot: links to the pages that buy or claim, shown only when the abilities allow it. */
function DefaultShopperActions({ bundle }: { bundle: BundleView }) {
  if (bundle.abilities.buy) {
    return <ButtonLink to={paths.app.basketAdd.getHref(bundle.id)}>{bundle.offer === 'sale' ? 'Add to basket' : 'Ask for it: add to basket'}</ButtonLink>;
  }
  if (bundle.abilities.claim) {
    return <ButtonLink to={paths.app.starter.getHref()}>Claim through the starter programme</ButtonLink>;
  }
  if (bundle.offer === 'starter' && bundle.state === 'on_shelf') {
    return <p className="text-thread-soft">Starter bundles are kept for new quilters, who claim them through the starter programme.</p>;
  }
  if (bundle.offer === 'starter' && bundle.state === 'held') {
    return (
      <p className="text-thread-soft">
        The new quilter first on the waiting list has been offered it and is deciding. If they pass it on, it goes to the next new quilter in line.
      </p>
    );
  }
  if (bundle.state !== 'on_shelf') return <p className="text-thread-soft">This bundle is not on offer at the moment.</p>;
  return null;
}

function Disclosure({ ok, yes, no }: { ok: boolean; yes: string; no: string }) {
  return (
    <li className="flex items-start gap-2">
      <span aria-hidden="true" className={ok ? 'font-bold text-sage' : 'font-bold text-ochre'}>
        {ok ? '✓' : '!'}
      </span>
      <span>{ok ? yes : no}</span>
    </li>
  );
}

function Facts({ facts }: { facts: Array<[string, ReactNode]> }) {
  return (
    <dl className="grid gap-x-6 sm:grid-cols-[11rem_1fr] sm:gap-y-2 max-sm:[&>dd]:mb-2">
      {facts.map(([term, detail]) => (
        <div key={term} className="contents">
          <dt className="font-semibold text-thread-soft">{term}</dt>
          <dd>{detail}</dd>
        </div>
      ))}
    </dl>
  );
}
