import { describe, expect, it } from 'vitest';
import {
  checkListing,
  emptyPieceRow,
  formFieldOf,
  formValuesFromBundle,
  lengthToText,
  listingResolver,
  parseLengthText,
  parseWeightText,
  stepOfField,
  toDraftInput,
  weightToText,
  type ListingContext,
  type ListingFormValues,
} from './listing-form.ts';

const imperial: ListingContext = { units: 'imperial', currency: 'USD' };
const metric: ListingContext = { units: 'metric', currency: 'GBP' };

const blank = (overrides: Partial<ListingFormValues> = {}): ListingFormValues => ({ ...formValuesFromBundle(null, imperial), ...overrides });

describe('weights typed by members (factors from NIST SP 811 appendix B: 1 oz = 28.349523125 g, 1 lb = 453.59237 g)', () => {
  it('reads imperial weights with their unit into whole grams, half up', () => {
    expect(parseWeightText('8 oz', 'imperial')).toBe(227); // 226.796185 g
    expect(parseWeightText('2 lb', 'imperial')).toBe(907); // 907.18474 g
    expect(parseWeightText('1 lb 4 oz', 'imperial')).toBe(567); // 566.99 g
  });

  it('reads a bare number as ounces for an imperial member and grams for a metric one, as the shelf’s weight filter does', () => {
    expect(parseWeightText('40', 'imperial')).toBe(1134); // 1133.98 g = 2 lb 8 oz
    expect(parseWeightText('12', 'imperial')).toBe(parseWeightText('12 oz', 'imperial'));
    expect(parseWeightText('750', 'metric')).toBe(750);
    expect(parseWeightText('1.2 kg', 'metric')).toBe(1200);
    expect(parseWeightText('a big bag', 'imperial')).toBeNull();
  });

  it('sends a bare number as the weight instead of dropping it', () => {
    const { input, problems } = toDraftInput(blank({ weightText: '40' }), imperial);
    expect(problems).toEqual({});
    expect(input.weightGrams).toBe(1134);
  });

  it('shows stored grams as text that reads back to the very same grams', () => {
    expect(weightToText(454, 'imperial')).toBe('1 lb');
    // 500 g shows as "1 lb 2 oz", which is 510 g: ounces to 0.01 keep it exact instead.
    expect(weightToText(500, 'imperial')).toBe('17.64 oz');
    expect(weightToText(1234, 'metric')).toBe('1234 g');
    expect(weightToText(350, 'metric')).toBe('350 g');
    for (const grams of [1, 29, 227, 454, 500, 999, 1234, 4321, 50_000]) {
      expect(parseWeightText(weightToText(grams, 'imperial'), 'imperial')).toBe(grams);
      expect(parseWeightText(weightToText(grams, 'metric'), 'metric')).toBe(grams);
    }
  });
});

describe('piece sizes (1 in = 25.4 mm exactly, NIST SP 811)', () => {
  it('reads inches as quilters write them', () => {
    expect(parseLengthText('2½', 'imperial')).toBe(64); // 63.5 mm, half up
    expect(parseLengthText('2 1/2', 'imperial')).toBe(64);
    expect(parseLengthText('42', 'imperial')).toBe(1067); // 1066.8 mm
    expect(parseLengthText('6.5', 'metric')).toBe(65);
  });

  it('shows stored millimetres as text that reads back to the same millimetres', () => {
    expect(lengthToText(457, 'imperial')).toBe('18');
    expect(lengthToText(64, 'imperial')).toBe('2½');
    expect(lengthToText(100, 'imperial')).toBe('3.94');
    expect(lengthToText(64, 'metric')).toBe('6.4');
    for (const mm of [10, 64, 100, 457, 559, 914, 1067, 4999]) {
      expect(parseLengthText(lengthToText(mm, 'imperial'), 'imperial')).toBe(mm);
      expect(parseLengthText(lengthToText(mm, 'metric'), 'metric')).toBe(mm);
    }
  });
});

describe('the draft the form describes', () => {
  it('sends only what is filled in, with booleans and lists always', () => {
    const { input, problems } = toDraftInput(blank(), imperial);
    expect(problems).toEqual({});
    expect(input).toEqual({
      description: '',
      cutKinds: [],
      cutSizes: [],
      colourValue: null,
      colourFamily: null,
      prewashed: false,
      smokeFree: false,
      petFree: false,
      pieces: [],
      priceMinor: null,
      meetingHandoverOk: false,
      quantity: 1,
    });
  });

  it('converts a full sale listing to stored integers', () => {
    const { input, problems } = toDraftInput(
      blank({
        title: 'Warm reds',
        cutKinds: ['strips', 'fat_quarters'],
        // The square size goes: squares are not ticked.
        cutSizes: ['strip_2_5', 'square_5'],
        fibre: 'quilting_cotton',
        weightText: '1 lb 4 oz',
        pieces: [{ width: '18', height: '22', count: '2' }, emptyPieceRow(), { width: '2 1/2', height: '42', count: '14' }],
        offer: 'sale',
        priceText: '12.50',
        meetingHandoverOk: true,
        quantity: '3',
      }),
      imperial,
    );
    expect(problems).toEqual({});
    expect(input).toMatchObject({
      title: 'Warm reds',
      cutSizes: ['strip_2_5'],
      weightGrams: 567,
      pieces: [
        { widthMm: 457, heightMm: 559, count: 2 },
        { widthMm: 64, heightMm: 1067, count: 14 },
      ],
      offer: 'sale',
      priceMinor: 1250,
      meetingHandoverOk: true,
      quantity: 3,
    });
  });

  it('keeps no price and no handover choice on a free offer, whatever was typed before switching', () => {
    const { input } = toDraftInput(blank({ offer: 'postage_only', priceText: '5', meetingHandoverOk: true }), imperial);
    expect(input).toMatchObject({ offer: 'postage_only', priceMinor: null, meetingHandoverOk: false });
  });

  it('names each field it cannot read, by form field', () => {
    const { problems } = toDraftInput(
      blank({ weightText: 'a dozen', offer: 'sale', priceText: '12.505', quantity: 'two', pieces: [{ width: '18', height: 'wide', count: '1.5' }] }),
      imperial,
    );
    expect(Object.keys(problems).sort()).toEqual(['pieces.0.count', 'pieces.0.height', 'priceText', 'quantity', 'weightText']);
    expect(problems.weightText).toMatch(/1 lb 4 oz/);
    expect(problems.priceText).toMatch(/USD/);
  });

  it('reads a price in a currency without minor units (ISO 4217: JPY has 0 decimals)', () => {
    const yen = toDraftInput(blank({ offer: 'sale', priceText: '1200' }), { units: 'metric', currency: 'JPY' });
    expect(yen.input.priceMinor).toBe(1200);
    expect(toDraftInput(blank({ offer: 'sale', priceText: '12.5' }), { units: 'metric', currency: 'JPY' }).problems.priceText).toBeDefined();
  });

  it('round-trips a stored bundle through the form unchanged', () => {
    const { input } = toDraftInput(
      blank({ title: 'Flannel squares', fibre: 'flannel', weightText: weightToText(500, 'metric'), pieces: [{ width: lengthToText(127, 'metric'), height: '12.7', count: '8' }] }),
      metric,
    );
    expect(input).toMatchObject({ weightGrams: 500, pieces: [{ widthMm: 127, heightMm: 127, count: 8 }] });
  });
});

describe('checking the listing with the shared schemas', () => {
  it('finds nothing wrong with an empty draft: a draft saves what is filled in', () => {
    expect(checkListing(blank(), imperial, 'draft').errors).toEqual({});
  });

  it('lists what the librarian still needs, in the order of the steps, in plain words', () => {
    const { errors } = checkListing(blank(), imperial, 'complete');
    expect(Object.keys(errors)).toEqual(['title', 'cutKinds', 'fibre', 'weightText', 'offer']);
    expect(errors).toMatchObject({
      title: 'Give the bundle a title.',
      cutKinds: 'Choose at least one cut kind.',
      weightText: 'Enter the weight of one pack.',
    });
  });

  it('wants a price for a sale before review, but not in a draft', () => {
    const sale = blank({ title: 'Batik bits', cutKinds: ['improv'], fibre: 'batik', weightText: '12 oz', offer: 'sale' });
    expect(checkListing(sale, imperial, 'draft').errors).toEqual({});
    expect(checkListing(sale, imperial, 'complete').errors).toEqual({ priceText: 'A sale needs a price.' });
  });

  it('puts schema messages for pieces on the row they were typed in, past blank rows', () => {
    const { errors } = checkListing(blank({ pieces: [emptyPieceRow(), { width: '0.2', height: '5', count: '1' }] }), imperial, 'draft');
    expect(errors).toEqual({ 'pieces.1.width': 'At least 10 mm.' });
  });

  it('gives react-hook-form nested errors, and the values when all is well', async () => {
    const resolve = listingResolver(imperial);
    const options = { fields: {}, shouldUseNativeValidation: false } as Parameters<typeof resolve>[2];
    const bad = await resolve(blank({ weightText: 'lots', pieces: [{ width: 'x', height: '5', count: '1' }] }), undefined, options);
    expect(bad.errors).toMatchObject({ weightText: { message: expect.any(String) }, pieces: [{ width: { message: expect.any(String) } }] });
    const good = await resolve(blank({ title: 'Selvages' }), undefined, options);
    expect(good.errors).toEqual({});
    expect(good.values).toMatchObject({ title: 'Selvages' });
  });
});

describe('fields and steps', () => {
  it('maps API field names to the form’s', () => {
    expect(formFieldOf('weightGrams')).toBe('weightText');
    expect(formFieldOf('priceMinor')).toBe('priceText');
    expect(formFieldOf('cutKinds.0')).toBe('cutKinds');
    expect(formFieldOf('pieces.1.heightMm', [0, 3])).toBe('pieces.3.height');
    expect(formFieldOf('photos')).toBe('photos');
  });

  it('knows which step shows each field, API names included (the 422 on submit uses them)', () => {
    expect(['photos', 'title', 'petFree', 'weightGrams', 'pieces.0.width', 'priceMinor', 'quantity', 'body'].map(stepOfField)).toEqual([
      'photos',
      'contents',
      'contents',
      'weight',
      'weight',
      'offer',
      'offer',
      'review',
    ]);
  });
});
