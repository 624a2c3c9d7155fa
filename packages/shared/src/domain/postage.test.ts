import { describe, expect, it } from 'vitest';
import {
  DEFAULT_POSTAGE_TABLE,
  type DimensionalRule,
  type PostageResult,
  type PostageTable,
  dimensionalWeight,
  matchZone,
  mmDimensionsToInches,
  poundBandLimitGrams,
  quotePostage,
  roundUpToWholePounds,
} from './postage.ts';
import { GRAMS_PER_OUNCE, formatPostalWeight } from './units.ts';

const USPS_2019: DimensionalRule = { divisorCubicInchesPerPound: 166, thresholdCubicInches: 1728, roundEachDimensionUp: false };
const PRIVATE_CARRIER: DimensionalRule = { divisorCubicInchesPerPound: 139, thresholdCubicInches: 0, roundEachDimensionUp: false };

describe('dimensionalWeight (carriers published rules, CHECKS.md)', () => {
  it('14 × 12 × 11 in, divisor 166 above 1,728 in³ → 1,848 in³ → 11.13 → 12 lb (Postal Bulletin 22509)', () => {
    const d = dimensionalWeight([14, 12, 11], USPS_2019);
    expect(d.volumeCubicInches).toBe(1848);
    expect(d.volumeCubicInches / 166).toBeCloseTo(11.13, 2);
    expect(d.applies).toBe(true);
    expect(d.pounds).toBe(12);
    expect(d.grams).toBe(5443); // 12 × 453.59237 = 5443.1 g, rounded down like a 12-lb band's limit
  });

  it('12 × 12 × 12 in = 1,728 in³ is not above the threshold, so not applied (Postal Bulletin 22509, boundary)', () => {
    const d = dimensionalWeight([12, 12, 12], USPS_2019);
    expect(d.volumeCubicInches).toBe(1728);
    expect(d.applies).toBe(false);
    expect(d.pounds).toBeNull();
    expect(d.grams).toBeNull();
  });

  it('private carriers, divisor 139 for all sizes: 12 × 9 × 7 = 756 in³ → 5.44 → 6 lb (CHECKS.md)', () => {
    const d = dimensionalWeight([12, 9, 7], PRIVATE_CARRIER);
    expect(d.volumeCubicInches).toBe(756);
    expect(d.pounds).toBe(6);
  });

  it('rounds each fractional inch up when the rule says so (Federal Register final rule 2026-09785, medium confidence)', () => {
    const d = dimensionalWeight([11.2, 8.1, 6.5], { ...PRIVATE_CARRIER, roundEachDimensionUp: true });
    expect(d.dimensionsIn).toEqual([12, 9, 7]);
    expect(d.pounds).toBe(6);
  });

  it('converts millimetres exactly, so a 304.8 mm cube is exactly 12 in and stays at the boundary', () => {
    expect(mmDimensionsToInches([304.8, 304.8, 304.8])).toEqual([12, 12, 12]);
    const rounded = dimensionalWeight(mmDimensionsToInches([304.8, 304.8, 304.8]), { ...USPS_2019, roundEachDimensionUp: true });
    expect(rounded.volumeCubicInches).toBe(1728);
    expect(rounded.applies).toBe(false);
  });

  it('at 1 lb and over any fraction counts as a whole pound: 16.01 oz → 2 lb (quick service guide)', () => {
    expect(roundUpToWholePounds(16.01 * GRAMS_PER_OUNCE)).toBe(2);
    expect(roundUpToWholePounds(16 * GRAMS_PER_OUNCE)).toBe(1);
    expect(poundBandLimitGrams(1)).toBe(453);
    expect(poundBandLimitGrams(2)).toBe(907);
  });
});

describe('matchZone', () => {
  const zones = [
    { code: 'town', postalPrefixes: ['K0A 1'] },
    { code: 'county', postalPrefixes: ['k0'] },
    { code: 'country', postalPrefixes: ['*'] },
  ];

  it('takes the first zone whose prefix starts the code, ignoring case and spaces', () => {
    expect(matchZone(zones, 'k0a1b0')).toEqual({ zone: 'town', prefix: 'K0A 1' });
    expect(matchZone(zones, ' K0A 2C0 ')).toEqual({ zone: 'county', prefix: 'k0' });
    expect(matchZone(zones, 'M5V 3L9')).toEqual({ zone: 'country', prefix: '*' });
  });

  it('returns null when nothing matches and there is no catch-all', () => {
    expect(matchZone(zones.slice(0, 2), 'M5V 3L9')).toBeNull();
  });
});

/**
 * Hand-worked table (invented). Largest capacity: large box 9,000 − 400 = 8,600 g.
 * The large box is 14 × 12 × 11 in, so dimensional weight (12 lb = 5,443 g) applies to it.
 */
const TABLE: PostageTable = {
  dimensional: USPS_2019,
  zones: [
    { code: 'town', postalPrefixes: ['K0A 1'] },
    { code: 'county', postalPrefixes: ['K0'] },
    { code: 'country', postalPrefixes: ['*'] },
  ],
  bands: [
    { zone: 'town', maxGrams: 500, priceMinor: 300 },
    { zone: 'town', maxGrams: 2000, priceMinor: 600 },
    { zone: 'town', maxGrams: 5000, priceMinor: 900 },
    { zone: 'town', maxGrams: 10000, priceMinor: 1400 },
    // county is listed out of order and stops at 5 kg
    { zone: 'county', maxGrams: 2000, priceMinor: 800 },
    { zone: 'county', maxGrams: 500, priceMinor: 400 },
    { zone: 'county', maxGrams: 5000, priceMinor: 1200 },
    { zone: 'country', maxGrams: 500, priceMinor: 700 },
    { zone: 'country', maxGrams: 2000, priceMinor: 1100 },
    { zone: 'country', maxGrams: 5000, priceMinor: 1900 },
    { zone: 'country', maxGrams: 10000, priceMinor: 2600 },
  ],
  packaging: [
    { code: 'mailer', name: 'Padded mailer', innerMm: [216, 305, 25], tareGrams: 25, maxGrams: 1000, flatPriceMinor: null },
    { code: 'box', name: 'Small box', innerMm: [203, 152, 102], tareGrams: 110, maxGrams: 3000, flatPriceMinor: null },
    { code: 'flat', name: 'Flat-rate box', innerMm: [304.8, 304.8, 152.4], tareGrams: 200, maxGrams: 5000, flatPriceMinor: 1500 },
    { code: 'large', name: 'Large box', innerMm: [355.6, 304.8, 279.4], tareGrams: 400, maxGrams: 9000, flatPriceMinor: null },
  ],
  handlingMinor: 75,
};

function quoteOf(result: PostageResult) {
  if (!result.ok) throw new Error(`expected a quote, got ${result.error.code}: ${result.error.message}`);
  return result.quote;
}

describe('quotePostage (hand-worked invented table)', () => {
  it('picks the cheapest package that holds the parcel and explains each line', () => {
    const quote = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Blues', grams: 400 }], postalCode: 'k0a 1b0' }));
    expect(quote.zone).toBe('town');
    expect(quote.parcels).toEqual([
      {
        number: 1,
        units: [{ ref: 'Blues', grams: 400 }],
        packageCode: 'mailer',
        packageName: 'Padded mailer',
        contentGrams: 400,
        tareGrams: 25,
        dimensionalGrams: null,
        billableGrams: 425,
        zone: 'town',
        bandMaxGrams: 500,
        priceMinor: 300,
      },
    ]);
    expect(quote.totalMinor).toBe(375); // 300 + 75 handling
    expect(quote.explanation).toEqual([
      'Postal code “k0a 1b0” is in zone town (prefix “K0A 1”).',
      '1 unit packed heaviest first into 1 parcel of at most 8,600 g contents (Large box: 9,000 g less 400 g tare).',
      'Parcel 1: Blues 400 g = 400 g contents.',
      '  Padded mailer: 400 g + 25 g tare = 425 g; billable 425 g; zone town band up to 500 g: $3.00.',
      '  Small box: 400 g + 110 g tare = 510 g; billable 510 g; zone town band up to 2,000 g: $6.00.',
      '  Flat-rate box: flat price $15.00.',
      '  Large box: 400 g + 400 g tare = 800 g; dimensional 14 × 12 × 11 in = 1,848 in³ ÷ 166 → 12 lb = 5,443 g; billable 5,443 g; zone town band up to 10,000 g: $14.00.',
      '  → Padded mailer, $3.00.',
      'Handling: $0.75.',
      'Total postage: $3.75.',
    ]);
  });

  it('prefers a flat price when it beats the band, and the band when it beats the flat price', () => {
    const country = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Bag', grams: 2000 }], postalCode: 'V6B' }));
    // small box 2,110 g → country ≤ 5,000 g band $19.00; flat $15.00; large box billable 5,443 g → $26.00
    expect(country.parcels[0]?.packageCode).toBe('flat');
    expect(country.parcels[0]?.bandMaxGrams).toBeNull();
    expect(country.totalMinor).toBe(1575);

    const town = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Bag', grams: 2000 }], postalCode: 'K0A1A0' }));
    // small box 2,110 g → town ≤ 5,000 g band $9.00 beats flat $15.00 and large $14.00
    expect(town.parcels[0]?.packageCode).toBe('box');
    expect(town.parcels[0]?.priceMinor).toBe(900);
    expect(town.totalMinor).toBe(975);
  });

  it('packs heaviest first, first fit, into several parcels, with dimensional weight where it applies', () => {
    const quote = quoteOf(
      quotePostage({
        table: TABLE,
        items: [
          { ref: 'Strips', grams: 3000 },
          { ref: 'Yardage', grams: 5000 },
          { ref: 'Flannel', grams: 4000 },
        ],
        postalCode: 'K0A 1A0',
      }),
    );
    // 5,000 → parcel 1; 4,000 does not fit beside it (9,000 > 8,600) → parcel 2; 3,000 fits in parcel 1 (8,000).
    expect(quote.parcels.map((p) => p.units.map((u) => u.ref))).toEqual([['Yardage', 'Strips'], ['Flannel']]);
    const [first, second] = quote.parcels;
    // parcel 1: only the large box holds 8,000 + 400; billable 8,400 g → town ≤ 10,000 g $14.00
    expect(first).toMatchObject({ packageCode: 'large', contentGrams: 8000, billableGrams: 8400, dimensionalGrams: 5443, priceMinor: 1400 });
    // parcel 2: flat $15.00 vs large box billable max(4,400, 5,443) = 5,443 g → $14.00
    expect(second).toMatchObject({ packageCode: 'large', contentGrams: 4000, billableGrams: 5443, bandMaxGrams: 10000, priceMinor: 1400 });
    expect(quote.totalMinor).toBe(2875); // 1,400 + 1,400 + 75 handling
  });

  it('expands quantities into units and counts them once in the explanation', () => {
    const quote = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Strip pack', grams: 300, quantity: 3 }], postalCode: 'K0A 1A0' }));
    expect(quote.parcels).toHaveLength(1);
    expect(quote.parcels[0]?.contentGrams).toBe(900);
    expect(quote.parcels[0]?.packageCode).toBe('mailer'); // 925 g ≤ 1,000 g, band ≤ 2,000 g $6.00 ties the small box; mailer is smaller
    expect(quote.explanation[2]).toBe('Parcel 1: Strip pack 3 × 300 g = 900 g contents.');
  });

  it('refuses a unit heavier than the largest package holds, suggesting a meeting', () => {
    const result = quotePostage({ table: TABLE, items: [{ ref: 'Batting roll', grams: 8601 }], postalCode: 'K0A 1A0' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.error).toMatchObject({ code: 'too_heavy', ref: 'Batting roll', grams: 8601, maxContentGrams: 8600 });
    expect(result.error.message).toMatch(/meeting where the bundle offers it/);
    expect(quotePostage({ table: TABLE, items: [{ ref: 'Just fits', grams: 8600 }], postalCode: 'K0A 1A0' }).ok).toBe(true);
  });

  it('suggests a meeting only for a bundle that may change hands at one (design choice)', () => {
    const refused = (meetingHandover: boolean) => {
      const result = quotePostage({ table: TABLE, items: [{ ref: 'Batting roll', grams: 8601, meetingHandover }], postalCode: 'K0A 1A0' });
      return result.ok ? '' : result.error.message;
    };
    expect(refused(true)).toMatch(/Choose handover at a meeting instead\.$/);
    expect(refused(false)).toMatch(/goes by post only: ask the seller whether it can be sent as two smaller bundles/);
    expect(refused(false)).not.toMatch(/meeting/);
  });

  it('reports no_rate when no band of the zone covers the billable weight', () => {
    // county stops at 5,000 g; 6,000 g contents only fit the large box (6,400 g billable).
    const result = quotePostage({ table: TABLE, items: [{ ref: 'Wool', grams: 6000 }], postalCode: 'K0B 2C0' });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.code).toBe('no_rate');
  });

  it('sorts the zone bands by weight before looking up', () => {
    const quote = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Scraps', grams: 300 }], postalCode: 'K0B 2C0' }));
    expect(quote.parcels[0]).toMatchObject({ packageCode: 'mailer', bandMaxGrams: 500, priceMinor: 400 });
  });

  it('reports no_zone and nothing_to_post', () => {
    const noCatchAll = { ...TABLE, zones: TABLE.zones.slice(0, 2) };
    const noZone = quotePostage({ table: noCatchAll, items: [{ ref: 'Bag', grams: 100 }], postalCode: 'M5V' });
    expect(noZone.ok ? null : noZone.error.code).toBe('no_zone');
    const empty = quotePostage({ table: TABLE, items: [], postalCode: 'K0A 1A0' });
    expect(empty.ok ? null : empty.error.code).toBe('nothing_to_post');
  });

  it('adds handling once per quote, and leaves it out of the explanation when zero', () => {
    const quote = quoteOf(
      quotePostage({ table: { ...TABLE, handlingMinor: 0 }, items: [{ ref: 'Bag', grams: 400 }], postalCode: 'K0A 1A0' }),
    );
    expect(quote.totalMinor).toBe(300);
    expect(quote.explanation.some((line) => line.startsWith('Handling'))).toBe(false);
  });

  it('bills a whole pound beyond the limit with pound bands: 16.01 oz → the 2-lb band (quick service guide)', () => {
    const poundTable: PostageTable = {
      ...TABLE,
      zones: [{ code: 'all', postalPrefixes: ['*'] }],
      bands: [
        { zone: 'all', maxGrams: poundBandLimitGrams(1), priceMinor: 500 },
        { zone: 'all', maxGrams: poundBandLimitGrams(2), priceMinor: 800 },
      ],
      packaging: [{ code: 'bag', name: 'Poly bag', innerMm: [250, 350, 10], tareGrams: 0, maxGrams: 900, flatPriceMinor: null }],
      handlingMinor: 0,
    };
    const grams = Math.ceil(16.01 * GRAMS_PER_OUNCE); // 453.88 g → 454 g
    const quote = quoteOf(quotePostage({ table: poundTable, items: [{ ref: 'Bag', grams }], postalCode: 'X' }));
    expect(quote.parcels[0]?.bandMaxGrams).toBe(907);
    expect(quote.totalMinor).toBe(800);
    const underPound = quoteOf(quotePostage({ table: poundTable, items: [{ ref: 'Bag', grams: 453 }], postalCode: 'X' }));
    expect(underPound.totalMinor).toBe(500);
  });

  it('bills a box of exactly 12 dimensional pounds in the 12-lb band, not the next (Postal Bulletin 22509 example box)', () => {
    const boxTable: PostageTable = {
      ...TABLE,
      zones: [{ code: 'all', postalPrefixes: ['*'] }],
      bands: [
        { zone: 'all', maxGrams: poundBandLimitGrams(12), priceMinor: 1200 },
        { zone: 'all', maxGrams: poundBandLimitGrams(13), priceMinor: 1300 },
      ],
      // 14 × 12 × 11 in inside: 1,848 in³ / 166 → 12 lb.
      packaging: [{ code: 'box', name: 'Box', innerMm: [355.6, 304.8, 279.4], tareGrams: 400, maxGrams: 9000, flatPriceMinor: null }],
      handlingMinor: 0,
      dimensional: USPS_2019,
    };
    const quote = quoteOf(quotePostage({ table: boxTable, items: [{ ref: 'Yardage', grams: 1500 }], postalCode: 'X' }));
    expect(quote.parcels[0]?.bandMaxGrams).toBe(5443);
    expect(quote.totalMinor).toBe(1200);
  });
});

describe('the working for a reader who uses pounds and ounces', () => {
  it('keeps every sum in grams and gives the billable weight and the band in pounds and ounces too', () => {
    const metric = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Blues', grams: 400 }], postalCode: 'K0A 1B0' }));
    const imperial = quoteOf(quotePostage({ table: TABLE, items: [{ ref: 'Blues', grams: 400 }], postalCode: 'K0A 1B0', units: 'imperial' }));
    expect(imperial.totalMinor).toBe(metric.totalMinor);
    const billable = imperial.parcels[0]!.billableGrams;
    const text = imperial.explanation.join('\n');
    expect(text).toContain(`billable ${billable.toLocaleString('en-US')} g (${formatPostalWeight(billable, 'imperial', 'up')})`);
    expect(text).toContain('400 g'); // the content, still in grams, so the sums add up
    expect(metric.explanation.join('\n')).not.toContain(' oz');
  });
});

describe('countries a postage table covers', () => {
  const items = [{ ref: 'Bag', grams: 400 }];
  it('quotes an address in a listed country, in any letter case, and refuses one elsewhere', () => {
    const table: PostageTable = { ...TABLE, countries: ['CA'] };
    expect(quotePostage({ table, items, postalCode: 'K0A 1B0', country: 'ca' }).ok).toBe(true);
    const abroad = quotePostage({ table, items, postalCode: '97451', country: 'US' });
    expect(abroad.ok).toBe(false);
    expect(!abroad.ok && abroad.error).toMatchObject({ code: 'country_not_covered' });
  });

  it('quotes any country when none is listed, as tables saved before the list existed', () => {
    expect(quotePostage({ table: { ...TABLE, countries: [] }, items, postalCode: 'K0A 1B0', country: 'NZ' }).ok).toBe(true);
    expect(quotePostage({ table: TABLE, items, postalCode: 'K0A 1B0', country: 'NZ' }).ok).toBe(true);
  });
});

describe('DEFAULT_POSTAGE_TABLE (invented guild table)', () => {
  it('has the four presets with tares from CHECKS.md (from memory, ±30 %)', () => {
    const tare = (code: string) => DEFAULT_POSTAGE_TABLE.packaging.find((p) => p.code === code)?.tareGrams ?? Number.NaN;
    expect(DEFAULT_POSTAGE_TABLE.packaging.map((p) => p.code)).toEqual(['envelope', 'padded_mailer', 'small_box', 'medium_box']);
    expect(Math.abs(tare('padded_mailer') - 25)).toBeLessThanOrEqual(25 * 0.3);
    expect(Math.abs(tare('small_box') - 110)).toBeLessThanOrEqual(110 * 0.3);
    expect(Math.abs(tare('medium_box') - 425)).toBeLessThanOrEqual(425 * 0.3);
    for (const p of DEFAULT_POSTAGE_TABLE.packaging) expect(p.maxGrams).toBeGreaterThan(p.tareGrams);
  });

  it('uses the 2019 US postal dimensional rule (Postal Bulletin 22509), and its rates are for US addresses', () => {
    expect(DEFAULT_POSTAGE_TABLE.dimensional).toEqual(USPS_2019);
    expect(DEFAULT_POSTAGE_TABLE.countries).toEqual(['US']);
  });

  it('prices every zone up to the heaviest parcel the largest package can carry', () => {
    const largest = Math.max(...DEFAULT_POSTAGE_TABLE.packaging.map((p) => p.maxGrams));
    for (const zone of DEFAULT_POSTAGE_TABLE.zones) {
      const bands = DEFAULT_POSTAGE_TABLE.bands.filter((b) => b.zone === zone.code);
      expect(Math.max(...bands.map((b) => b.maxGrams))).toBeGreaterThanOrEqual(largest);
    }
    expect(DEFAULT_POSTAGE_TABLE.zones.at(-1)?.postalPrefixes).toEqual(['*']);
  });

  it('quotes a typical order', () => {
    const quote = quoteOf(
      quotePostage({ table: DEFAULT_POSTAGE_TABLE, items: [{ ref: 'Blues', grams: 680 }, { ref: 'Strips', grams: 230 }], postalCode: '97451' }),
    );
    // 910 g + 25 g tare = 935 g, over the 2-lb band (907 g) → 3-lb band (1,360 g), local $7.90;
    // the small box lands in the same band and price, and the tie goes to the smaller mailer.
    expect(quote.zone).toBe('local');
    expect(quote.parcels).toHaveLength(1);
    expect(quote.parcels[0]).toMatchObject({ packageCode: 'padded_mailer', billableGrams: 935, bandMaxGrams: 1360, priceMinor: 790 });
    expect(quote.totalMinor).toBe(840);
  });
});
