import {
  bundleCompleteSchema,
  bundleDraftSchema,
  CUT_SIZE_KIND,
  formatLength,
  formatWeight,
  GRAMS_PER_OUNCE,
  MM_PER_INCH,
  parseLengthToMm,
  parseMoneyToMinor,
  type BundleDraftInput,
  type BundleView,
  type ColourFamily,
  type ColourValue,
  type CutKind,
  type CutSize,
  type Fibre,
  type UnitSystem,
} from '@scrap-relay/shared';
import type { LISTING_OFFERS } from '@scrap-relay/shared';
import { set, type FieldErrors, type Resolver } from 'react-hook-form';
import { minorToMajorText } from '../../../utils/units.ts';
import { parseTypedWeight } from '../../../utils/weight-text.ts';

/**
 * The listing form in the words people type (weights as "1 lb 4 oz", prices as
 * "12.50", piece sizes as "2½"), and its conversion to the integers the API
 * stores, checked with the shared draft and complete schemas.
 */

export const LISTING_STEPS = ['photos', 'contents', 'weight', 'offer', 'review'] as const;
export type ListingStep = (typeof LISTING_STEPS)[number];

export const STEP_LABELS: Readonly<Record<ListingStep, string>> = {
  photos: 'Photos',
  contents: 'Contents',
  weight: 'Weight and pieces',
  offer: 'Offer and price',
  review: 'Review and submit',
};

export const isListingStep = (value: unknown): value is ListingStep => LISTING_STEPS.includes(value as ListingStep);

type ListingOffer = (typeof LISTING_OFFERS)[number];

export interface PieceRow {
  width: string;
  height: string;
  count: string;
}

export interface ListingFormValues {
  title: string;
  description: string;
  cutKinds: CutKind[];
  cutSizes: CutSize[];
  fibre: Fibre | '';
  colourValue: ColourValue | '';
  colourFamily: ColourFamily | '';
  prewashed: boolean;
  smokeFree: boolean;
  petFree: boolean;
  weightText: string;
  pieces: PieceRow[];
  offer: ListingOffer | '';
  priceText: string;
  meetingHandoverOk: boolean;
  quantity: string;
}

export interface ListingContext {
  units: UnitSystem;
  currency: string;
}

export const emptyPieceRow = (): PieceRow => ({ width: '', height: '', count: '1' });

/* ---------- text ↔ stored integers ---------- */

/** A bare number is grams or ounces by the member's units, as on the shelf's weight filter; the step reads it back as it is typed. */
export function parseWeightText(text: string, units: UnitSystem): number | null {
  if (text.trim() === '') return null;
  return parseTypedWeight(text, units);
}

/** A bare number is centimetres for metric members and inches ("2½", "2 1/2", "18") for imperial ones. */
export function parseLengthText(text: string, units: UnitSystem): number | null {
  if (text.trim() === '') return null;
  return parseLengthToMm(text, { bareUnit: units === 'metric' ? 'cm' : 'in' });
}

/**
 * Grams as text that reads back to exactly the same grams, so opening and
 * saving a draft never changes its weight: the usual display when it round-trips
 * ("1 lb 4 oz"), else ounces to two decimals (0.01 oz is 0.28 g, finer than a gram).
 */
export function weightToText(grams: number, units: UnitSystem): string {
  const shown = formatWeight(grams, units);
  if (parseWeightText(shown, units) === grams) return shown;
  return units === 'metric' ? `${grams} g` : `${(grams / GRAMS_PER_OUNCE).toFixed(2)} oz`;
}

/** Millimetres as text that reads back to the same millimetres: eighths of an inch when exact, else inches to 0.01. */
export function lengthToText(mm: number, units: UnitSystem): string {
  const shown = formatLength(mm, units).replace(/ (in|cm)$/, '');
  if (parseLengthText(shown, units) === mm) return shown;
  return units === 'metric' ? `${mm} mm` : (mm / MM_PER_INCH).toFixed(2);
}

export function formValuesFromBundle(bundle: BundleView | null, ctx: ListingContext): ListingFormValues {
  return {
    title: bundle?.title ?? '',
    description: bundle?.description ?? '',
    cutKinds: bundle ? [...bundle.cutKinds] : [],
    cutSizes: bundle ? [...bundle.cutSizes] : [],
    fibre: bundle?.fibre ?? '',
    colourValue: bundle?.colour.value ?? '',
    colourFamily: bundle?.colour.family ?? '',
    prewashed: bundle?.prewashed ?? false,
    smokeFree: bundle?.disclosures.smokeFree ?? false,
    petFree: bundle?.disclosures.petFree ?? false,
    weightText: bundle?.weightGrams != null ? weightToText(bundle.weightGrams, ctx.units) : '',
    pieces: (bundle?.pieces ?? []).map((piece) => ({
      width: lengthToText(piece.widthMm, ctx.units),
      height: lengthToText(piece.heightMm, ctx.units),
      count: String(piece.count),
    })),
    offer: bundle?.offer ?? '',
    priceText: bundle?.priceMinor != null ? minorToMajorText(bundle.priceMinor, ctx.currency) : '',
    meetingHandoverOk: bundle?.meetingHandoverOk ?? false,
    quantity: String(bundle?.quantity ?? 1),
  };
}

export interface Conversion {
  input: BundleDraftInput;
  /** What could not be read, by form field ("weightText", "pieces.0.width"). */
  problems: Record<string, string>;
  /** For each piece sent, the form row it came from (blank rows are left out). */
  pieceRows: number[];
}

const WHOLE = /^\d+$/;

/** The draft the form describes; fields left empty are left out, so a draft saves whatever is filled in. */
export function toDraftInput(values: ListingFormValues, ctx: ListingContext): Conversion {
  const problems: Record<string, string> = {};
  const input: BundleDraftInput = {
    description: values.description,
    cutKinds: values.cutKinds,
    // A size whose kind was unticked goes with it, as the API would drop it.
    cutSizes: values.cutSizes.filter((size) => values.cutKinds.includes(CUT_SIZE_KIND[size])),
    colourValue: values.colourValue || null,
    colourFamily: values.colourFamily || null,
    prewashed: values.prewashed,
    smokeFree: values.smokeFree,
    petFree: values.petFree,
  };
  if (values.title.trim() !== '') input.title = values.title;
  if (values.fibre) input.fibre = values.fibre;

  if (values.weightText.trim() !== '') {
    const grams = parseWeightText(values.weightText, ctx.units);
    if (grams === null) {
      problems.weightText =
        ctx.units === 'metric'
          ? 'Write the weight in grams or kilograms, for example 750 g or 1.2 kg.'
          : 'Write the weight in pounds and ounces, for example 1 lb 4 oz or 12 oz.';
    } else {
      input.weightGrams = grams;
    }
  }

  const pieces: NonNullable<BundleDraftInput['pieces']> = [];
  const pieceRows: number[] = [];
  const unitWord = ctx.units === 'metric' ? 'centimetres, for example 6.5' : 'inches, for example 2½, 2 1/2 or 18';
  values.pieces.forEach((row, index) => {
    if (row.width.trim() === '' && row.height.trim() === '' && (row.count.trim() === '' || row.count.trim() === '1')) return;
    const widthMm = parseLengthText(row.width, ctx.units);
    const heightMm = parseLengthText(row.height, ctx.units);
    const countText = row.count.trim() === '' ? '1' : row.count.trim();
    if (widthMm === null) problems[`pieces.${index}.width`] = `Enter the width in ${unitWord}.`;
    if (heightMm === null) problems[`pieces.${index}.height`] = `Enter the height in ${unitWord}.`;
    if (!WHOLE.test(countText)) problems[`pieces.${index}.count`] = 'Enter a whole number of pieces.';
    if (widthMm === null || heightMm === null || !WHOLE.test(countText)) return;
    pieces.push({ widthMm, heightMm, count: Number(countText) });
    pieceRows.push(index);
  });
  input.pieces = pieces;

  if (values.offer) input.offer = values.offer;
  if (values.offer === 'sale') {
    input.meetingHandoverOk = values.meetingHandoverOk;
    if (values.priceText.trim() === '') {
      input.priceMinor = null;
    } else {
      const minor = parseMoneyToMinor(values.priceText, ctx.currency);
      if (minor === null) problems.priceText = `Enter the price in ${ctx.currency}, for example ${minorToMajorText(1250, ctx.currency)}.`;
      else input.priceMinor = minor;
    }
  } else {
    // Free offers carry no price and no choice of handover; the API refuses them otherwise.
    input.priceMinor = null;
    input.meetingHandoverOk = false;
  }

  const quantity = values.quantity.trim();
  if (quantity !== '') {
    if (WHOLE.test(quantity)) input.quantity = Number(quantity);
    else problems.quantity = 'Enter a whole number of packs.';
  }
  return { input, problems, pieceRows };
}

/* ---------- fields, steps and messages ---------- */

const FORM_FIELD_OF: Readonly<Record<string, string>> = { weightGrams: 'weightText', priceMinor: 'priceText' };
const PIECE_FIELD_OF: Readonly<Record<string, string>> = { widthMm: 'width', heightMm: 'height', count: 'count' };

/** The form field for an API or schema field path: "weightGrams" → "weightText", "pieces.2.widthMm" → "pieces.<row>.width". */
export function formFieldOf(apiPath: string, pieceRows: readonly number[] = []): string {
  const [head = '', index, leaf] = apiPath.split('.');
  if (head === 'pieces' && index !== undefined && leaf !== undefined) {
    const row = pieceRows[Number(index)] ?? Number(index);
    return `pieces.${row}.${PIECE_FIELD_OF[leaf] ?? leaf}`;
  }
  if (head === 'cutKinds' || head === 'cutSizes') return head;
  return FORM_FIELD_OF[head] ?? head;
}

const STEP_OF_FIELD: Readonly<Record<string, ListingStep>> = {
  photos: 'photos',
  title: 'contents',
  description: 'contents',
  cutKinds: 'contents',
  cutSizes: 'contents',
  fibre: 'contents',
  colourValue: 'contents',
  colourFamily: 'contents',
  prewashed: 'contents',
  smokeFree: 'contents',
  petFree: 'contents',
  weightText: 'weight',
  weightGrams: 'weight',
  pieces: 'weight',
  offer: 'offer',
  priceText: 'offer',
  priceMinor: 'offer',
  meetingHandoverOk: 'offer',
  quantity: 'offer',
};

/** Which step shows a field (form or API name); unknown fields are read back on the review step. */
export function stepOfField(field: string): ListingStep {
  const head = field.split('.')[0] ?? field;
  return STEP_OF_FIELD[head] ?? 'review';
}

/** Names for fields in "still needed" lists. */
export const FIELD_LABELS: Readonly<Record<string, string>> = {
  photos: 'Photos',
  title: 'Title',
  description: 'Description',
  cutKinds: 'Cut kinds',
  cutSizes: 'Sizes',
  fibre: 'Fibre',
  colourValue: 'Colour value',
  colourFamily: 'Colour family',
  weightText: 'Weight',
  pieces: 'Pieces',
  offer: 'Offer',
  priceText: 'Price',
  meetingHandoverOk: 'Meeting handover',
  quantity: 'Number of packs',
};

export const fieldLabel = (field: string): string => FIELD_LABELS[field.split('.')[0] ?? field] ?? field;

// The complete schema's own wording for a missing key is written for the API ("whole grams"); people get these.
const MISSING: Readonly<Record<string, string>> = {
  title: 'Give the bundle a title.',
  offer: 'Choose how the bundle changes hands.',
  weightGrams: 'Enter the weight of one pack.',
  fibre: 'Choose the fibre.',
  quantity: 'Enter the number of packs.',
};

export interface ListingCheck {
  input: BundleDraftInput;
  /** Problems by form field, in form order. */
  errors: Record<string, string>;
}

/**
 * Checks the form as a draft (what is filled in must be valid) or as a complete
 * listing (what the librarian needs), with the shared schemas the API uses.
 */
export function checkListing(values: ListingFormValues, ctx: ListingContext, mode: 'draft' | 'complete'): ListingCheck {
  const { input, problems, pieceRows } = toDraftInput(values, ctx);
  const errors: Record<string, string> = { ...problems };
  const result = mode === 'draft' ? bundleDraftSchema.safeParse(input) : bundleCompleteSchema.safeParse(input);
  if (!result.success) {
    for (const issue of result.error.issues) {
      const apiPath = issue.path.join('.');
      const field = formFieldOf(apiPath, pieceRows);
      if (errors[field]) continue;
      // Left empty (zod says "invalid type" or "invalid value" depending on the field's kind).
      const missing = issue.path.length === 1 && input[apiPath as keyof BundleDraftInput] === undefined;
      errors[field] = (missing ? MISSING[apiPath] : undefined) ?? issue.message;
    }
  }
  return { input, errors: orderByStep(errors) };
}

function orderByStep(errors: Record<string, string>): Record<string, string> {
  const fieldOrder = Object.keys(STEP_OF_FIELD);
  const rank = (field: string) => {
    const at = fieldOrder.indexOf(field.split('.')[0] ?? field);
    return at === -1 ? fieldOrder.length : at;
  };
  return Object.fromEntries(Object.entries(errors).sort(([a], [b]) => rank(a) - rank(b) || a.localeCompare(b)));
}

/** react-hook-form resolver: the draft check, so fields complain as they are filled in, never about what is still empty. */
export function listingResolver(ctx: ListingContext): Resolver<ListingFormValues> {
  return (values) => {
    const { errors } = checkListing(values, ctx, 'draft');
    const nested: FieldErrors<ListingFormValues> = {};
    for (const [field, message] of Object.entries(errors)) set(nested, field, { type: 'validate', message });
    return Object.keys(errors).length === 0 ? { values, errors: {} } : { values: {}, errors: nested };
  };
}
