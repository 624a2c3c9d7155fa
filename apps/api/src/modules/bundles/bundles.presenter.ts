import { QueryTypes, type Sequelize } from 'sequelize';
import {
  averageColour,
  estimateYield,
  parseHex,
  planBundle,
  suggestColour,
  type BundleView,
  type ReviewQueueRow,
  type SellerSummary,
} from '@scrap-relay/shared';
import type { Bundle, BundlePhoto, Member } from '../../db/models/index.ts';
import type { FileStorage } from '../../integrations/storage.ts';
import { can, type Actor } from '../../policies/index.ts';

const firstName = (name: string) => name.trim().split(/\s+/)[0] ?? name;

/** How many bundles each seller has rehomed and how many listings came back from review. */
export async function sellerStats(sequelize: Sequelize, sellers: Member[]): Promise<Map<string, SellerSummary>> {
  const ids = [...new Set(sellers.map((s) => s.id))];
  const rows = ids.length
    ? await sequelize.query<{ seller_id: string; rehomed: number; returned: number }>(
        `SELECT s.id AS seller_id,
                (SELECT count(*)::int FROM bundles b WHERE b.seller_id = s.id AND b.state = 'rehomed') AS rehomed,
                (SELECT count(*)::int FROM bundle_reviews r JOIN bundles b ON b.id = r.bundle_id WHERE b.seller_id = s.id AND r.decision = 'return') AS returned
         FROM unnest($1::uuid[]) AS s(id)`,
        { bind: [ids], type: QueryTypes.SELECT },
      )
    : [];
  const byId = new Map(rows.map((r) => [r.seller_id, r]));
  return new Map(
    sellers.map((s) => [s.id, { id: s.id, firstName: firstName(s.name), rehomedCount: byId.get(s.id)?.rehomed ?? 0, returnedCount: byId.get(s.id)?.returned ?? 0 }]),
  );
}

/** The suggestion averages the photos' own averages, each photo counting once. */
function suggestedColour(photos: BundlePhoto[]) {
  const rgbs = photos.map((p) => parseHex(p.averageHex)).filter((c) => c !== null);
  if (rgbs.length === 0) return null;
  const avg = averageColour(rgbs.flatMap((c) => [c.r, c.g, c.b]), 3);
  if (!avg) return null;
  const s = suggestColour(avg);
  return { value: s.value, family: s.family, hex: s.hex };
}

export function presentBundle(bundle: Bundle, viewer: Actor, seller: SellerSummary, storage: FileStorage): BundleView {
  const photos = [...(bundle.photos ?? [])].sort((a, b) => a.position - b.position);
  return {
    id: bundle.id,
    title: bundle.title,
    description: bundle.description,
    state: bundle.state,
    offer: bundle.offer,
    priceMinor: bundle.priceMinor,
    currency: bundle.currency,
    meetingHandoverOk: bundle.meetingHandoverOk,
    quantity: bundle.quantity,
    quantityAvailable: bundle.quantityAvailable,
    weightGrams: bundle.weightGrams,
    fibre: bundle.fibre,
    cutKinds: bundle.cutKinds,
    cutSizes: bundle.cutSizes,
    colour: { value: bundle.colourValue, family: bundle.colourFamily, suggested: suggestedColour(photos) },
    prewashed: bundle.prewashed,
    disclosures: { smokeFree: bundle.smokeFree, petFree: bundle.petFree },
    pieces: bundle.pieces,
    photos: photos.map((p) => ({
      id: p.id,
      url: storage.publicUrl(p.displayKey),
      thumbUrl: storage.publicUrl(p.thumbKey),
      mediumUrl: p.mediumKey ? storage.publicUrl(p.mediumKey) : null,
      width: p.width,
      height: p.height,
      averageHex: p.averageHex,
    })),
    yield: bundle.weightGrams ? estimateYield({ grams: bundle.weightGrams, fibre: bundle.fibre ?? 'mixed_unknown' }) : null,
    cutPlan: bundle.pieces.length ? planBundle(bundle.pieces) : null,
    seller,
    reviewNotes: bundle.sellerId === viewer.id || viewer.roles.includes('librarian') ? bundle.reviewNotes : null,
    submittedAt: bundle.submittedAt?.toISOString() ?? null,
    onShelfAt: bundle.onShelfAt?.toISOString() ?? null,
    expiresAt: bundle.expiresAt?.toISOString() ?? null,
    createdAt: bundle.createdAt.toISOString(),
    updatedAt: bundle.updatedAt.toISOString(),
    abilities: {
      edit: can(viewer, 'bundle.edit', bundle),
      submit: can(viewer, 'bundle.submit', bundle),
      withdraw: can(viewer, 'bundle.withdraw', bundle),
      relist: can(viewer, 'bundle.relist', bundle),
      review: can(viewer, 'bundle.review', bundle),
      buy: can(viewer, 'bundle.buy', bundle),
      claim: can(viewer, 'bundle.claim', bundle),
    },
  };
}

export function presentReviewRow(bundle: Bundle, viewer: Actor, seller: SellerSummary & { name: string }, storage: FileStorage): ReviewQueueRow {
  const first = [...(bundle.photos ?? [])].sort((a, b) => a.position - b.position)[0];
  return {
    id: bundle.id,
    title: bundle.title,
    offer: bundle.offer!,
    priceMinor: bundle.priceMinor,
    currency: bundle.currency,
    weightGrams: bundle.weightGrams!,
    fibre: bundle.fibre!,
    thumbUrl: first ? storage.publicUrl(first.thumbKey) : null,
    photoCount: bundle.photos?.length ?? 0,
    seller,
    submittedAt: bundle.submittedAt!.toISOString(),
    disclosures: { smokeFree: bundle.smokeFree, petFree: bundle.petFree },
    abilities: { review: can(viewer, 'bundle.review', bundle) },
  };
}
