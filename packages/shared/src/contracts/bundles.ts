import type { BundleCutPlan, BundleState, ColourFamily, ColourValue, CutKind, CutSize, Fibre, Offer, YieldEstimate } from '../domain/index.ts';
import type { PieceInput } from '../schemas/bundles.ts';

export interface PhotoView {
  id: string;
  url: string;
  thumbUrl: string;
  /** 800 px on the long side; null for photos stored before that size was made (use the thumbnail). */
  mediumUrl: string | null;
  width: number;
  height: number;
  averageHex: string;
}

export interface BundleAbilities {
  edit: boolean;
  submit: boolean;
  withdraw: boolean;
  relist: boolean;
  review: boolean;
  buy: boolean;
  claim: boolean;
}

export interface SellerSummary {
  id: string;
  firstName: string;
  rehomedCount: number;
  returnedCount: number;
}

export interface BundleView {
  id: string;
  title: string;
  description: string;
  state: BundleState;
  offer: Offer | null;
  priceMinor: number | null;
  currency: string;
  meetingHandoverOk: boolean;
  quantity: number;
  quantityAvailable: number;
  weightGrams: number | null;
  fibre: Fibre | null;
  cutKinds: CutKind[];
  /** Standard strip widths and square sizes in the bag, if the seller said. */
  cutSizes: CutSize[];
  colour: {
    value: ColourValue | null;
    family: ColourFamily | null;
    suggested: { value: ColourValue; family: ColourFamily; hex: string } | null;
  };
  prewashed: boolean;
  disclosures: { smokeFree: boolean; petFree: boolean };
  pieces: PieceInput[];
  photos: PhotoView[];
  yield: YieldEstimate | null;
  cutPlan: BundleCutPlan | null;
  seller: SellerSummary;
  reviewNotes: string | null;
  submittedAt: string | null;
  onShelfAt: string | null;
  expiresAt: string | null;
  createdAt: string;
  updatedAt: string;
  abilities: BundleAbilities;
}

export interface BundleCard {
  id: string;
  title: string;
  offer: Offer;
  priceMinor: number | null;
  currency: string;
  meetingHandoverOk: boolean;
  quantityAvailable: number;
  weightGrams: number;
  fibre: Fibre;
  cutKinds: CutKind[];
  colour: { value: ColourValue | null; family: ColourFamily | null };
  thumbUrl: string | null;
  /** The first photo at 800 px, for sharp screens; null when it has none (older photos). */
  thumb2xUrl: string | null;
  yield: YieldEstimate;
  onShelfAt: string;
}

export interface Page<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

/**
 * The shelf's page: `total` stops at 1,000 (a text search's at four pages past the page asked for), and
 * `totalCapped` says there are more.
 */
export interface ShelfPage extends Page<BundleCard> {
  totalCapped: boolean;
}

export interface ReviewQueueRow {
  id: string;
  title: string;
  offer: Offer;
  priceMinor: number | null;
  currency: string;
  weightGrams: number;
  fibre: Fibre;
  thumbUrl: string | null;
  photoCount: number;
  seller: SellerSummary & { name: string };
  submittedAt: string;
  disclosures: { smokeFree: boolean; petFree: boolean };
  abilities: { review: boolean };
}

export interface WishView {
  id: string;
  name: string;
  filters: Record<string, string | number>;
  createdAt: string;
}
