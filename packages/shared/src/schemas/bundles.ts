import { z } from 'zod';
import { COLOUR_FAMILIES, COLOUR_VALUES, CUT_KINDS, CUT_SIZE_KIND, CUT_SIZE_LABELS, CUT_SIZES, FIBRES } from '../domain/fibres.ts';

/** Offers a member can choose when listing; `starter` donates the bundle to the starter programme for new quilters. */
export const LISTING_OFFERS = ['sale', 'postage_only', 'meeting', 'starter'] as const;
/** The shelf shows what can be bought or asked for; starter bundles are claimed through the starter programme. */
export const SHELF_OFFERS = ['sale', 'postage_only', 'meeting'] as const;
export const listingOfferSchema = z.enum(LISTING_OFFERS, { error: 'Choose how the bundle changes hands.' });

export const MAX_PHOTOS_PER_BUNDLE = 8;
export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const MAX_BUNDLE_GRAMS = 50_000;
export const MAX_PRICE_MINOR = 100_000;

export const pieceSchema = z.strictObject({
  widthMm: z.int({ error: 'Enter the width in whole millimetres.' }).min(10, { error: 'At least 10 mm.' }).max(5_000, { error: 'At most 5 m.' }),
  heightMm: z.int({ error: 'Enter the height in whole millimetres.' }).min(10, { error: 'At least 10 mm.' }).max(5_000, { error: 'At most 5 m.' }),
  count: z.int({ error: 'Enter a whole number.' }).min(1, { error: 'At least 1.' }).max(500, { error: 'At most 500.' }),
});
export type PieceInput = z.infer<typeof pieceSchema>;

const fields = {
  title: z.string({ error: 'Give the bundle a title.' }).trim().min(3, { error: 'Use at least 3 characters.' }).max(80, { error: 'Use at most 80 characters.' }),
  description: z.string().trim().max(2_000, { error: 'Use at most 2,000 characters.' }),
  offer: listingOfferSchema,
  priceMinor: z.int({ error: 'Enter the price in whole cents.' }).min(1, { error: 'A sale needs a price.' }).max(MAX_PRICE_MINOR).nullable(),
  meetingHandoverOk: z.boolean(),
  quantity: z.int({ error: 'Enter a whole number of packs.' }).min(1, { error: 'At least 1.' }).max(50, { error: 'At most 50.' }),
  weightGrams: z
    .int({ error: 'Enter the weight in whole grams.' })
    .min(1, { error: 'The weight must be more than 0.' })
    .max(MAX_BUNDLE_GRAMS, { error: 'At most 50 kg per pack.' }),
  fibre: z.enum(FIBRES, { error: 'Choose a fibre from the list.' }),
  cutKinds: z
    .array(z.enum(CUT_KINDS, { error: 'Choose cut kinds from the list.' }))
    .max(CUT_KINDS.length)
    .refine((a) => new Set(a).size === a.length, { error: 'Each cut kind once.' }),
  cutSizes: z
    .array(z.enum(CUT_SIZES, { error: 'Choose sizes from the list.' }))
    .max(CUT_SIZES.length)
    .refine((a) => new Set(a).size === a.length, { error: 'Each size once.' }),
  colourValue: z.enum(COLOUR_VALUES, { error: 'Choose light, medium, dark or mixed.' }).nullable(),
  colourFamily: z.enum(COLOUR_FAMILIES, { error: 'Choose a colour family from the list.' }).nullable(),
  prewashed: z.boolean(),
  smokeFree: z.boolean(),
  petFree: z.boolean(),
  pieces: z.array(pieceSchema).max(50, { error: 'At most 50 rows of pieces.' }),
};

/** Free offers carry no price; a sale needs one. Checked wherever both are known. */
function priceFitsOffer(v: { offer?: string | null; priceMinor?: number | null; meetingHandoverOk?: boolean }, ctx: z.RefinementCtx) {
  if (!v.offer || v.offer === 'sale') return;
  if (v.priceMinor != null) ctx.addIssue({ code: 'custom', path: ['priceMinor'], message: 'A free offer has no price.' });
  if (v.meetingHandoverOk) ctx.addIssue({ code: 'custom', path: ['meetingHandoverOk'], message: 'Only a sale has a choice of handover.' });
}

/** A strip width needs strips among the cut kinds, a square size squares; checked wherever both are known. */
function sizesFitKinds(v: { cutKinds?: readonly string[]; cutSizes?: readonly (typeof CUT_SIZES)[number][] }, ctx: z.RefinementCtx) {
  if (!v.cutSizes || !v.cutKinds) return;
  const missing = v.cutSizes.find((size) => !v.cutKinds!.includes(CUT_SIZE_KIND[size]));
  if (missing) {
    const kind = CUT_SIZE_KIND[missing] === 'strips' ? 'Strips' : 'Squares';
    ctx.addIssue({ code: 'custom', path: ['cutSizes'], message: `${CUT_SIZE_LABELS[missing]} need ${kind} among the cut kinds.` });
  }
}

/** A draft saves whatever has been filled in so far; each field present must be valid. */
export const bundleDraftSchema = z.strictObject(fields).partial().superRefine(priceFitsOffer).superRefine(sizesFitKinds);
export type BundleDraftInput = z.infer<typeof bundleDraftSchema>;

/** What a bundle needs before the librarian sees it. */
export const bundleCompleteSchema = z
  .object({
    ...fields,
    description: fields.description.default(''),
    cutKinds: fields.cutKinds.min(1, { error: 'Choose at least one cut kind.' }),
    cutSizes: fields.cutSizes.default([]),
  })
  .superRefine(priceFitsOffer)
  .superRefine(sizesFitKinds)
  .superRefine((v, ctx) => {
    if (v.offer === 'sale' && v.priceMinor == null) ctx.addIssue({ code: 'custom', path: ['priceMinor'], message: 'A sale needs a price.' });
  });
export type BundleCompleteInput = z.infer<typeof bundleCompleteSchema>;

export const reviewDecisionSchema = z
  .strictObject({
    decision: z.enum(['approve', 'return'], { error: 'Choose approve or return.' }),
    notes: z.string().trim().max(2_000, { error: 'Use at most 2,000 characters.' }).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.decision === 'return' && !v.notes) ctx.addIssue({ code: 'custom', path: ['notes'], message: 'Tell the member what to change.' });
  });
export type ReviewDecisionInput = z.infer<typeof reviewDecisionSchema>;

export const SHELF_SORTS = ['newest', 'price_asc', 'price_desc', 'weight_asc', 'weight_desc'] as const;

const queryInt = (max: number) => z.coerce.number({ error: 'Enter a whole number.' }).int({ error: 'Enter a whole number.' }).min(0).max(max);

/** Shelf filters: the shelf's query string, a saved wish's criteria. */
export const shelfFiltersSchema = z.strictObject({
  offer: z.enum(SHELF_OFFERS, { error: 'Unknown offer.' }).optional(),
  cut: z.enum(CUT_KINDS, { error: 'Unknown cut kind.' }).optional(),
  size: z.enum(CUT_SIZES, { error: 'Unknown size.' }).optional(),
  value: z.enum(COLOUR_VALUES, { error: 'Unknown colour value.' }).optional(),
  family: z.enum(COLOUR_FAMILIES, { error: 'Unknown colour family.' }).optional(),
  fibre: z.enum(FIBRES, { error: 'Unknown fibre.' }).optional(),
  minGrams: queryInt(MAX_BUNDLE_GRAMS).optional(),
  maxGrams: queryInt(MAX_BUNDLE_GRAMS).optional(),
  maxPriceMinor: queryInt(MAX_PRICE_MINOR).optional(),
  q: z.string().trim().max(100, { error: 'Use at most 100 characters.' }).optional(),
});
export type ShelfFilters = z.infer<typeof shelfFiltersSchema>;

export const shelfQuerySchema = shelfFiltersSchema.extend({
  sort: z.enum(SHELF_SORTS, { error: 'Unknown sort.' }).default('newest'),
  page: z.coerce.number().int().min(1, { error: 'Pages start at 1.' }).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(60).default(24),
});
export type ShelfQuery = z.infer<typeof shelfQuerySchema>;

export const wishSchema = z.strictObject({
  name: z.string().trim().min(1, { error: 'Name the wish.' }).max(80, { error: 'Use at most 80 characters.' }),
  filters: shelfFiltersSchema.refine((f) => Object.values(f).some((v) => v !== undefined && v !== ''), {
    error: 'Choose at least one filter to wish for.',
  }),
});
export type WishInput = z.infer<typeof wishSchema>;

export const starterClaimSchema = z.strictObject({
  meetingId: z.uuid({ error: 'Choose a meeting.' }).optional(),
});

export const waitlistRemovalSchema = z.strictObject({
  reason: z.string({ error: 'Give a reason.' }).trim().min(3, { error: 'Give a reason.' }).max(300),
});

export const handoverMoveSchema = z.strictObject({
  toMeetingId: z.uuid({ error: 'Choose the meeting to move them to.' }),
});

export const yieldRequestSchema = z.strictObject({
  weightGrams: fields.weightGrams,
  fibre: fields.fibre,
  pieces: fields.pieces.optional(),
});
export type YieldRequest = z.infer<typeof yieldRequestSchema>;
