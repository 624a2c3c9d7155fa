/**
 * Postage quote from the guild's postage table.
 *
 * Rules, in order:
 * 1. Zone: the first zone (in table order) with a prefix that matches the start of the
 *    destination postal code, case and spaces ignored; the prefix `*` matches every code.
 * 2. Units (one per bundle copy) are packed heaviest first, first-fit, into parcels whose
 *    contents may not exceed the largest package's capacity (maxGrams − tareGrams of the
 *    package that holds the most). A unit heavier than that cannot be posted: error
 *    `too_heavy`, suggesting meeting handover where the bundle allows it. Packing looks at weight only; the table
 *    knows no bundle sizes.
 * 3. Each parcel takes the package with the lowest price among those that hold it
 *    (contents + tare ≤ maxGrams): the flat price if the package has one, otherwise the
 *    band price for its billable weight in the zone. Ties go to the smaller package, then
 *    to table order.
 * 4. Billable weight = max(contents + tare, dimensional weight). Dimensional weight
 *    applies only when the package's volume in cubic inches (each dimension converted
 *    exactly from mm, rounded up to a whole inch when `roundEachDimensionUp`) exceeds the
 *    threshold: ceil(volume ÷ divisor) pounds, converted to grams and rounded up.
 * 5. Band: the first band of the zone, by ascending maxGrams, that covers the billable
 *    weight; none: error `no_rate`. (Carriers that bill whole pounds are expressed as
 *    bands at pound limits; see poundBandLimitGrams.)
 * 6. Total = sum of parcel prices + handling (once per quote).
 */
import type { UnitSystem } from '../schemas/members.ts';
import { GRAMS_PER_POUND, formatMoney, formatPostalWeight } from './units.ts';

export interface DimensionalRule {
  divisorCubicInchesPerPound: number;
  /** Dimensional weight applies only above this volume; 0 means always. */
  thresholdCubicInches: number;
  roundEachDimensionUp: boolean;
}

export interface PostageZone {
  code: string;
  postalPrefixes: readonly string[];
}

export interface PostageBand {
  zone: string;
  maxGrams: number;
  priceMinor: number;
}

export interface PackagingPreset {
  code: string;
  name: string;
  /** Inner length, width, height in mm; decimals allowed so 12 in can be exactly 304.8. */
  innerMm: readonly [number, number, number];
  tareGrams: number;
  /** Most the package may weigh, contents and tare together. */
  maxGrams: number;
  flatPriceMinor: number | null;
}

export interface PostageTable {
  /** Two-letter codes of the countries the rates are for; none listed means any address is quoted. */
  countries?: readonly string[];
  dimensional: DimensionalRule;
  zones: readonly PostageZone[];
  bands: readonly PostageBand[];
  packaging: readonly PackagingPreset[];
  handlingMinor: number;
}

export interface PostageItem {
  /** What the unit is called in the explanation and the packing list (bundle title or id). */
  ref: string;
  /** Content weight of one unit, grams. */
  grams: number;
  /** Identical units of this item; 1 by default. */
  quantity?: number;
  /**
   * Whether the bundle may also change hands at a guild meeting (`allowsFulfilment`). It decides what a
   * refusal suggests instead: a meeting handover, or asking the seller. Unknown when left out.
   */
  meetingHandover?: boolean;
}

export interface PostageQuoteInput {
  table: PostageTable;
  items: readonly PostageItem[];
  postalCode: string;
  /** Two-letter country code of the address; checked against the table's countries when given. */
  country?: string;
  /** For the explanation's prices; the table itself holds minor units only. */
  currency?: string;
  locale?: string;
  /**
   * The reader's units. The working stays in grams, so its sums add up exactly; for `imperial` the
   * billable weight, the band and the too-heavy message also give pounds and ounces.
   */
  units?: UnitSystem;
}

export interface QuotedParcel {
  /** 1-based, in packing order. */
  number: number;
  units: Array<{ ref: string; grams: number }>;
  packageCode: string;
  packageName: string;
  contentGrams: number;
  tareGrams: number;
  /** Dimensional weight in grams when it applies to the chosen package, else null. */
  dimensionalGrams: number | null;
  billableGrams: number;
  zone: string;
  /** Band limit used, null when the package has a flat price. */
  bandMaxGrams: number | null;
  priceMinor: number;
}

export interface PostageQuote {
  zone: string;
  parcels: QuotedParcel[];
  handlingMinor: number;
  totalMinor: number;
  /** Line-by-line working, for the buyer and the seller. */
  explanation: string[];
}

export type PostageErrorCode = 'nothing_to_post' | 'country_not_covered' | 'no_zone' | 'too_heavy' | 'no_rate';

export interface PostageError {
  code: PostageErrorCode;
  message: string;
  /** For too_heavy: the unit that does not fit, its weight and the most a parcel holds. */
  ref?: string;
  grams?: number;
  maxContentGrams?: number;
}

export type PostageResult = { ok: true; quote: PostageQuote } | { ok: false; error: PostageError };

/* ---------- dimensional weight ---------- */

export interface DimensionalWeight {
  /** Dimensions used, inches (rounded up when the rule says so). */
  dimensionsIn: [number, number, number];
  volumeCubicInches: number;
  applies: boolean;
  /** Whole pounds when it applies, else null. */
  pounds: number | null;
  /**
   * The pounds in grams when it applies, else null: rounded down, as a band's limit is
   * (`poundBandLimitGrams`), so a parcel of exactly N dimensional pounds is billed in the N-lb band.
   */
  grams: number | null;
}

/** Dimensional weight of a package measured in inches. */
export function dimensionalWeight(dimensionsIn: readonly [number, number, number], rule: DimensionalRule): DimensionalWeight {
  if (!(rule.divisorCubicInchesPerPound > 0)) throw new RangeError('Dimensional divisor must be positive');
  const used = dimensionsIn.map((d) => (rule.roundEachDimensionUp ? Math.ceil(d) : d)) as [number, number, number];
  const volumeCubicInches = used[0] * used[1] * used[2];
  const applies = volumeCubicInches > rule.thresholdCubicInches;
  const pounds = applies ? Math.ceil(volumeCubicInches / rule.divisorCubicInchesPerPound) : null;
  return {
    dimensionsIn: used,
    volumeCubicInches,
    applies,
    pounds,
    grams: pounds === null ? null : poundBandLimitGrams(pounds),
  };
}

/**
 * Millimetres to inches exactly: via whole micrometres, so 304.8 mm is exactly 12 in and a
 * rounded-up dimension never gains an inch from float noise.
 */
export function mmDimensionsToInches(innerMm: readonly [number, number, number]): [number, number, number] {
  return innerMm.map((mm) => Math.round(mm * 1000) / 25_400) as [number, number, number];
}

/** Whole pounds a carrier bills for a weight when any fraction counts as a pound. */
export const roundUpToWholePounds = (grams: number): number => Math.ceil(grams / GRAMS_PER_POUND);

/**
 * The largest whole-gram weight within a pound limit, for building bands: 2 lb → 907 g.
 * Rounded down so a parcel billed in a band never exceeds the carrier's limit.
 */
export const poundBandLimitGrams = (pounds: number): number => Math.floor(pounds * GRAMS_PER_POUND);

/* ---------- zones ---------- */

const normalisePostal = (code: string): string => code.replace(/\s+/g, '').toUpperCase();

/** The zone for a postal code and the prefix that matched, or null. */
export function matchZone(zones: readonly PostageZone[], postalCode: string): { zone: string; prefix: string } | null {
  const code = normalisePostal(postalCode);
  for (const zone of zones) {
    for (const prefix of zone.postalPrefixes) {
      const p = normalisePostal(prefix);
      if (p === '*' || (p !== '' && code.startsWith(p))) return { zone: zone.code, prefix };
    }
  }
  return null;
}

/* ---------- the quote ---------- */

const decimal = (n: number): string => n.toLocaleString('en-US', { maximumFractionDigits: 2 });
const grams = (g: number): string => `${decimal(g)} g`;
/** Grams, with pounds and ounces beside them for a reader who uses them. */
const gramsFor =
  (units: UnitSystem | undefined, round: 'up' | 'nearest' = 'nearest') =>
  (g: number): string =>
    units === 'imperial' ? `${grams(g)} (${formatPostalWeight(g, 'imperial', round)})` : grams(g);
const volumeOf = (p: PackagingPreset): number => p.innerMm[0] * p.innerMm[1] * p.innerMm[2];

interface Unit {
  ref: string;
  grams: number;
  meetingHandover: boolean | undefined;
}

function expandUnits(items: readonly PostageItem[]): Unit[] {
  const units: Unit[] = [];
  for (const item of items) {
    const quantity = item.quantity ?? 1;
    if (!Number.isInteger(item.grams) || item.grams <= 0 || !Number.isInteger(quantity) || quantity < 1) {
      throw new RangeError(`Bad postage item ${JSON.stringify(item)}`);
    }
    for (let i = 0; i < quantity; i++) units.push({ ref: item.ref, grams: item.grams, meetingHandover: item.meetingHandover });
  }
  return units;
}

/** What a refused quote suggests instead, from whether the bundles it refused may change hands at a meeting. */
function otherWay(units: readonly Unit[], why: 'too_heavy' | 'abroad'): string {
  if (units.every((u) => u.meetingHandover === true)) return 'Choose handover at a meeting instead.';
  if (units.every((u) => u.meetingHandover === false)) {
    return why === 'too_heavy'
      ? 'It goes by post only: ask the seller whether it can be sent as two smaller bundles.'
      : 'It goes by post only: ask the seller whether it can be passed on another way.';
  }
  return 'Choose handover at a meeting where the bundle offers it, or ask the seller.';
}

/** Heaviest first, first fit; the sort is stable, so equal weights keep the order given. */
function packUnits(units: readonly Unit[], maxContentGrams: number): Unit[][] {
  const parcels: Array<{ content: number; units: Unit[] }> = [];
  for (const unit of [...units].sort((a, b) => b.grams - a.grams)) {
    const parcel = parcels.find((p) => p.content + unit.grams <= maxContentGrams);
    if (parcel) {
      parcel.units.push(unit);
      parcel.content += unit.grams;
    } else {
      parcels.push({ content: unit.grams, units: [unit] });
    }
  }
  return parcels.map((p) => p.units);
}

interface Candidate {
  preset: PackagingPreset;
  dimensional: DimensionalWeight;
  billableGrams: number;
  band: PostageBand | null;
  priceMinor: number | null;
}

function priceCandidate(preset: PackagingPreset, contentGrams: number, zoneBands: readonly PostageBand[], rule: DimensionalRule): Candidate {
  const dimensional = dimensionalWeight(mmDimensionsToInches(preset.innerMm), rule);
  const billableGrams = Math.max(contentGrams + preset.tareGrams, dimensional.grams ?? 0);
  if (preset.flatPriceMinor !== null) {
    return { preset, dimensional, billableGrams, band: null, priceMinor: preset.flatPriceMinor };
  }
  const band = zoneBands.find((b) => b.maxGrams >= billableGrams) ?? null;
  return { preset, dimensional, billableGrams, band, priceMinor: band ? band.priceMinor : null };
}

export function quotePostage(input: PostageQuoteInput): PostageResult {
  const { table } = input;
  const money = (minor: number) => formatMoney(minor, input.currency ?? 'USD', input.locale ?? 'en-US');
  const weight = gramsFor(input.units);
  const billedWeight = gramsFor(input.units, 'up');
  const units = expandUnits(input.items);
  if (units.length === 0) return fail('nothing_to_post', 'There is nothing to post.');
  const covered = table.countries ?? [];
  const country = input.country?.trim().toUpperCase();
  if (country !== undefined && covered.length > 0 && !covered.includes(country)) {
    return fail('country_not_covered', `The guild's postage table has rates for ${covered.join(', ')} only, not ${country}. ${otherWay(units, 'abroad')}`);
  }

  const matched = matchZone(table.zones, input.postalCode);
  if (!matched) return fail('no_zone', `The guild's postage table has no zone for postal code “${input.postalCode}”.`);
  const zone = matched.zone;
  const explanation = [`Postal code “${input.postalCode}” is in zone ${zone} (prefix “${matched.prefix}”).`];

  const largest = [...table.packaging].sort((a, b) => b.maxGrams - b.tareGrams - (a.maxGrams - a.tareGrams))[0];
  if (!largest) return fail('no_rate', 'The guild has no packaging in its postage table.');
  const maxContentGrams = largest.maxGrams - largest.tareGrams;
  const heaviest = units.reduce((a, b) => (b.grams > a.grams ? b : a));
  if (heaviest.grams > maxContentGrams) {
    return {
      ok: false,
      error: {
        code: 'too_heavy',
        message: `“${heaviest.ref}” weighs ${weight(heaviest.grams)}; the largest package (${largest.name}) holds ${weight(maxContentGrams)}. ${otherWay([heaviest], 'too_heavy')}`,
        ref: heaviest.ref,
        grams: heaviest.grams,
        maxContentGrams,
      },
    };
  }

  const packed = packUnits(units, maxContentGrams);
  explanation.push(
    `${units.length} ${units.length === 1 ? 'unit' : 'units'} packed heaviest first into ${packed.length} ${packed.length === 1 ? 'parcel' : 'parcels'} ` +
      `of at most ${grams(maxContentGrams)} contents (${largest.name}: ${grams(largest.maxGrams)} less ${grams(largest.tareGrams)} tare).`,
  );

  const zoneBands = table.bands.filter((b) => b.zone === zone).sort((a, b) => a.maxGrams - b.maxGrams);
  const parcels: QuotedParcel[] = [];
  for (const [index, parcelUnits] of packed.entries()) {
    const number = index + 1;
    const contentGrams = parcelUnits.reduce((sum, u) => sum + u.grams, 0);
    explanation.push(
      `Parcel ${number}: ${describeUnits(parcelUnits)} = ${grams(contentGrams)} contents.`,
    );
    const candidates = table.packaging
      .filter((p) => contentGrams + p.tareGrams <= p.maxGrams)
      .map((p) => priceCandidate(p, contentGrams, zoneBands, table.dimensional));
    for (const c of candidates) explanation.push(`  ${describeCandidate(c, contentGrams, zone, table.dimensional, money, weight, billedWeight)}`);

    const chosen = candidates
      .filter((c): c is Candidate & { priceMinor: number } => c.priceMinor !== null)
      .reduce<(Candidate & { priceMinor: number }) | null>((best, c) => {
        if (!best || c.priceMinor < best.priceMinor) return c;
        if (c.priceMinor === best.priceMinor && volumeOf(c.preset) < volumeOf(best.preset)) return c;
        return best;
      }, null);
    if (!chosen) {
      return fail('no_rate', `No package has a rate in zone ${zone} for parcel ${number} (${grams(contentGrams)} contents).`);
    }
    explanation.push(`  → ${chosen.preset.name}, ${money(chosen.priceMinor)}.`);
    parcels.push({
      number,
      units: parcelUnits.map((u) => ({ ref: u.ref, grams: u.grams })),
      packageCode: chosen.preset.code,
      packageName: chosen.preset.name,
      contentGrams,
      tareGrams: chosen.preset.tareGrams,
      dimensionalGrams: chosen.dimensional.grams,
      billableGrams: chosen.billableGrams,
      zone,
      bandMaxGrams: chosen.band?.maxGrams ?? null,
      priceMinor: chosen.priceMinor,
    });
  }

  const parcelsMinor = parcels.reduce((sum, p) => sum + p.priceMinor, 0);
  const totalMinor = parcelsMinor + table.handlingMinor;
  if (table.handlingMinor !== 0) explanation.push(`Handling: ${money(table.handlingMinor)}.`);
  explanation.push(`Total postage: ${money(totalMinor)}.`);
  return { ok: true, quote: { zone, parcels, handlingMinor: table.handlingMinor, totalMinor, explanation } };
}

/** "Strips 3 × 400 g + Blues 1,200 g": identical units next to each other are counted once. */
function describeUnits(units: readonly Unit[]): string {
  const groups: Array<{ unit: Unit; count: number }> = [];
  for (const unit of units) {
    const last = groups[groups.length - 1];
    if (last && last.unit.ref === unit.ref && last.unit.grams === unit.grams) last.count++;
    else groups.push({ unit, count: 1 });
  }
  return groups.map(({ unit, count }) => `${unit.ref} ${count > 1 ? `${count} × ` : ''}${grams(unit.grams)}`).join(' + ');
}

function describeCandidate(
  c: Candidate,
  contentGrams: number,
  zone: string,
  rule: DimensionalRule,
  money: (minor: number) => string,
  weight: (g: number) => string,
  billedWeight: (g: number) => string,
): string {
  const name = c.preset.name;
  if (c.preset.flatPriceMinor !== null) return `${name}: flat price ${money(c.preset.flatPriceMinor)}.`;
  const gross = contentGrams + c.preset.tareGrams;
  const parts = [`${name}: ${grams(contentGrams)} + ${grams(c.preset.tareGrams)} tare = ${grams(gross)}`];
  const d = c.dimensional;
  if (d.applies && d.grams !== null) {
    parts.push(
      `dimensional ${d.dimensionsIn.map(decimal).join(' × ')} in = ${decimal(d.volumeCubicInches)} in³ ÷ ${rule.divisorCubicInchesPerPound} → ${d.pounds} lb = ${grams(d.grams)}`,
    );
  }
  parts.push(`billable ${billedWeight(c.billableGrams)}`);
  const price = c.band
    ? `zone ${zone} band up to ${weight(c.band.maxGrams)}: ${money(c.band.priceMinor)}.`
    : `no band in zone ${zone} covers it.`;
  return `${parts.join('; ')}; ${price}`;
}

function fail(code: PostageErrorCode, message: string): PostageResult {
  return { ok: false, error: { code, message } };
}

/* ---------- default table ---------- */

/** Bands at whole- or half-pound limits: [pounds, priceMinor] pairs. */
function poundBands(zone: string, limits: ReadonlyArray<readonly [number, number]>): PostageBand[] {
  return limits.map(([pounds, priceMinor]) => ({ zone, maxGrams: poundBandLimitGrams(pounds), priceMinor }));
}

/**
 * A starting table for a guild (invented rates and postal prefixes; the admin replaces
 * them). Dimensional rule: divisor 166 above 1,728 in³ (US postal service until July
 * 2026, Postal Bulletin 22509). Tares from memory, ±30 %: padded mailer about 25 g,
 * small 8 × 6 × 4 in box about 110 g, 12-in cube box about 425 g. The medium box is a
 * 300 mm cube (just under 12 in) so it stays below the dimensional threshold.
 */
export const DEFAULT_POSTAGE_TABLE: PostageTable = {
  countries: ['US'],
  dimensional: { divisorCubicInchesPerPound: 166, thresholdCubicInches: 1728, roundEachDimensionUp: false },
  zones: [
    { code: 'local', postalPrefixes: ['9745'] },
    { code: 'regional', postalPrefixes: ['97', '98'] },
    { code: 'national', postalPrefixes: ['*'] },
  ],
  bands: [
    ...poundBands('local', [[0.5, 450], [1, 520], [2, 680], [3, 790], [5, 990], [10, 1450], [20, 2200]]),
    ...poundBands('regional', [[0.5, 520], [1, 610], [2, 820], [3, 960], [5, 1240], [10, 1890], [20, 2900]]),
    ...poundBands('national', [[0.5, 610], [1, 720], [2, 1030], [3, 1250], [5, 1690], [10, 2650], [20, 4200]]),
  ],
  packaging: [
    { code: 'envelope', name: 'Envelope', innerMm: [241, 318, 13], tareGrams: 15, maxGrams: 450, flatPriceMinor: null },
    { code: 'padded_mailer', name: 'Padded mailer', innerMm: [216, 305, 25], tareGrams: 25, maxGrams: 1800, flatPriceMinor: null },
    { code: 'small_box', name: 'Small box', innerMm: [203, 152, 102], tareGrams: 110, maxGrams: 4500, flatPriceMinor: null },
    { code: 'medium_box', name: 'Medium box', innerMm: [300, 300, 300], tareGrams: 425, maxGrams: 9000, flatPriceMinor: 2450 },
  ],
  handlingMinor: 50,
};
