/**
 * The product's fixed vocabularies (PRODUCT.md): fibres, cut kinds, colour value and
 * family, offers, fulfilments, bundle and order states. Plain const arrays and unions, so
 * schemas, the API and the web app all spell them the same way without pulling in zod.
 */

export const FIBRES = [
  'quilting_cotton',
  'batik',
  'flannel',
  'linen',
  'lawn_voile',
  'wool',
  'knit',
  'mixed_unknown',
] as const;
export type Fibre = (typeof FIBRES)[number];

export const FIBRE_LABELS: Readonly<Record<Fibre, string>> = {
  quilting_cotton: 'Quilting cotton',
  batik: 'Batik',
  flannel: 'Flannel',
  linen: 'Linen or linen blend',
  lawn_voile: 'Lawn / voile',
  wool: 'Wool',
  knit: 'Knit',
  mixed_unknown: 'Mixed / unknown',
};

/**
 * Typical fabric weight in g/m², the divisor of the yield estimate.
 * Cotton 140, batik 140 and flannel 185 are the CHECKS.md defaults (common practice;
 * flannel from memory). The rest are from memory, mid-range of what makers list:
 * linen and blends 150–200, lawn and voile 60–90, wool for appliqué and quilting 250–350,
 * cotton jersey knits 150–220. Mixed/unknown assumes quilting cotton, the usual bag.
 */
export const FIBRE_TYPICAL_GSM: Readonly<Record<Fibre, number>> = {
  quilting_cotton: 140,
  batik: 140,
  flannel: 185,
  linen: 175,
  lawn_voile: 75,
  wool: 300,
  knit: 180,
  mixed_unknown: 140,
};

export const CUT_KINDS = [
  'strips',
  'squares',
  'fat_quarters',
  'fat_eighths',
  'yardage',
  'improv',
  'selvages',
  'orphan_blocks',
  'epp_shapes',
  'binding',
  'batting',
] as const;
export type CutKind = (typeof CUT_KINDS)[number];

export const CUT_KIND_LABELS: Readonly<Record<CutKind, string>> = {
  strips: 'Strips (by width)',
  squares: 'Squares (by size)',
  fat_quarters: 'Fat quarters',
  fat_eighths: 'Fat eighths',
  yardage: 'Yardage remnants',
  improv: 'Irregular pieces for improv',
  selvages: 'Selvages',
  orphan_blocks: 'Orphan blocks',
  epp_shapes: 'English paper piecing shapes',
  binding: 'Pre-joined binding',
  batting: 'Batting offcuts',
};

/**
 * The standard sizes a bag of strips or squares may hold: the widths and squares patterns most often call for
 * (common practice). Each belongs to one cut kind, which the bundle must have.
 */
export const CUT_SIZES = ['strip_1_5', 'strip_2', 'strip_2_5', 'strip_3_5', 'strip_5', 'square_2_5', 'square_5', 'square_10'] as const;
export type CutSize = (typeof CUT_SIZES)[number];

export const CUT_SIZE_KIND: Readonly<Record<CutSize, 'strips' | 'squares'>> = {
  strip_1_5: 'strips',
  strip_2: 'strips',
  strip_2_5: 'strips',
  strip_3_5: 'strips',
  strip_5: 'strips',
  square_2_5: 'squares',
  square_5: 'squares',
  square_10: 'squares',
};

export const CUT_SIZE_LABELS: Readonly<Record<CutSize, string>> = {
  strip_1_5: '1½-inch strips',
  strip_2: '2-inch strips',
  strip_2_5: '2½-inch strips',
  strip_3_5: '3½-inch strips',
  strip_5: '5-inch strips',
  square_2_5: '2½-inch squares',
  square_5: '5-inch squares',
  square_10: '10-inch squares',
};

/** "2½-inch strips, 5-inch squares", or null for none. */
export const cutSizesText = (sizes: readonly CutSize[] | undefined): string | null =>
  sizes && sizes.length > 0 ? sizes.map((size) => CUT_SIZE_LABELS[size]).join(', ') : null;

export const COLOUR_VALUES = ['light', 'medium', 'dark', 'mixed'] as const;
export type ColourValue = (typeof COLOUR_VALUES)[number];

export const COLOUR_VALUE_LABELS: Readonly<Record<ColourValue, string>> = {
  light: 'Light',
  medium: 'Medium',
  dark: 'Dark',
  mixed: 'Mixed values',
};

export const COLOUR_FAMILIES = ['warm', 'cool', 'neutral', 'black_white', 'multi'] as const;
export type ColourFamily = (typeof COLOUR_FAMILIES)[number];

export const COLOUR_FAMILY_LABELS: Readonly<Record<ColourFamily, string>> = {
  warm: 'Warm',
  cool: 'Cool',
  neutral: 'Neutral',
  black_white: 'Black and white',
  multi: 'Multicoloured',
};

export const OFFERS = ['sale', 'postage_only', 'meeting', 'starter'] as const;
export type Offer = (typeof OFFERS)[number];

export const OFFER_LABELS: Readonly<Record<Offer, string>> = {
  sale: 'For sale',
  postage_only: 'Free, buyer pays postage',
  meeting: 'Free, at a guild meeting',
  starter: 'Starter bundle',
};

export const FULFILMENTS = ['post', 'meeting'] as const;
export type Fulfilment = (typeof FULFILMENTS)[number];

/**
 * How each offer may change hands: sales, postage-only gifts and starter bundles the guild posts go by
 * post; meeting gifts, and sales that allow it, at a meeting (starter claims for a meeting are made on
 * the starter page). The API enforces it at checkout; the web app lays out the basket by it.
 */
export function allowsFulfilment(bundle: { offer: Offer | null; meetingHandoverOk: boolean }, fulfilment: Fulfilment): boolean {
  if (fulfilment === 'post') return bundle.offer === 'sale' || bundle.offer === 'postage_only' || bundle.offer === 'starter';
  return bundle.offer === 'meeting' || (bundle.offer === 'sale' && bundle.meetingHandoverOk);
}

export const BUNDLE_STATES = [
  'draft',
  'in_review',
  'on_shelf',
  'held',
  'rehomed',
  'returned',
  'withdrawn',
  'expired',
] as const;
export type BundleState = (typeof BUNDLE_STATES)[number];

export const BUNDLE_STATE_LABELS: Readonly<Record<BundleState, string>> = {
  draft: 'Draft',
  in_review: 'Waiting for review',
  on_shelf: 'On the shelf',
  held: 'Held at checkout',
  rehomed: 'Rehomed',
  returned: 'Returned with notes',
  withdrawn: 'Withdrawn',
  expired: 'Expired',
};

/**
 * Allowed bundle moves (design choice). Besides the main line draft → in_review →
 * on_shelf → held → rehomed:
 * - returned and expired bundles are edited and resubmitted to review; a withdrawn one
 *   can be revived as a draft;
 * - the librarian may return a bundle that is already on the shelf;
 * - held → on_shelf releases an unpaid checkout or a lapsed/declined starter offer;
 * - on_shelf → rehomed covers claims and free orders with nothing to pay;
 * - rehomed → on_shelf puts a bundle back when its order is cancelled or refunded.
 */
export const BUNDLE_TRANSITIONS: Readonly<Record<BundleState, readonly BundleState[]>> = {
  draft: ['in_review', 'withdrawn'],
  in_review: ['on_shelf', 'returned', 'withdrawn'],
  on_shelf: ['held', 'rehomed', 'returned', 'withdrawn', 'expired'],
  held: ['on_shelf', 'rehomed'],
  rehomed: ['on_shelf'],
  returned: ['in_review', 'withdrawn'],
  withdrawn: ['draft'],
  expired: ['in_review', 'withdrawn'],
};

/** Whether a bundle may move from one state to another (never to itself). */
export function canTransition(from: BundleState, to: BundleState): boolean {
  return BUNDLE_TRANSITIONS[from].includes(to);
}

export const ORDER_STATES = [
  'awaiting_payment',
  'confirmed',
  'posted',
  'received',
  'handed_over',
  'cancelled',
  'refunded',
] as const;
export type OrderState = (typeof ORDER_STATES)[number];

export const ORDER_STATE_LABELS: Readonly<Record<OrderState, string>> = {
  awaiting_payment: 'Awaiting payment',
  confirmed: 'Confirmed',
  posted: 'Posted',
  received: 'Received',
  handed_over: 'Handed over',
  cancelled: 'Cancelled',
  refunded: 'Refunded',
};

/**
 * Allowed order moves (design choice): cancel before anything was paid or sent; once
 * money has moved, undoing is a refund; cancelled and refunded are final.
 */
export const ORDER_TRANSITIONS: Readonly<Record<OrderState, readonly OrderState[]>> = {
  awaiting_payment: ['confirmed', 'cancelled'],
  confirmed: ['posted', 'handed_over', 'cancelled', 'refunded'],
  posted: ['received', 'refunded'],
  received: ['refunded'],
  // Back to `confirmed` only as the same-day correction of a tick made by mistake at the meeting's door (the
  // librarian's untick, `HANDOVER_UNTICK`): the bag never changed hands. It is no way to take a bag back later.
  handed_over: ['refunded', 'confirmed'],
  cancelled: [],
  refunded: [],
};

/** The one move that goes back: unticking a meeting handover ticked by mistake, on the meeting's day. */
export const HANDOVER_UNTICK = { from: 'handed_over', to: 'confirmed' } as const satisfies { from: OrderState; to: OrderState };

/** Whether an order may move from one state to another. */
export function canOrderTransition(from: OrderState, to: OrderState): boolean {
  return ORDER_TRANSITIONS[from].includes(to);
}

/**
 * Where the bag is decides when its seller's credit may be paid out (design choice). Once the bag has gone out —
 * posted (and perhaps received since) or handed over at a meeting — the credit is payable. While the order is only
 * `confirmed` (paid, or nothing to pay, and the bag still with the seller) it may yet be cancelled or refunded with
 * nothing sent, so its credit waits: paying it out then would leave the guild chasing the seller for it.
 * Cancelled and refunded orders carry their reversal beside their credit and net to nothing, so they are in neither.
 */
export const BAG_OUT_ORDER_STATES = ['posted', 'received', 'handed_over'] as const satisfies readonly OrderState[];
export const CREDIT_WAITING_ORDER_STATES = ['confirmed'] as const satisfies readonly OrderState[];
