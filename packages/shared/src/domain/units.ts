/**
 * Units: exact conversion factors, parsing of what members type, and display formatting.
 *
 * Storage is integer grams and integer millimetres. The factors are the exact
 * international yard and pound (NIST SP 811, appendix B); never 2.2 or 28.35.
 *
 * Rounding rule for parsed and formatted values: round half up to the whole unit, done in
 * exact rational arithmetic (every factor here is a terminating decimal), so "1.0005 kg"
 * really is 1000.5 g → 1001 g and float noise never flips a half. Half up rather than half
 * even matters for lengths: an odd multiple of 2½ in is a half millimetre (63.5 mm), and
 * rounding it up means a stored piece is never smaller than the cut it was measured for.
 */
import type { UnitSystem } from '../schemas/members.ts';

export const MM_PER_INCH = 25.4;
export const MM_PER_YARD = 914.4;
export const INCHES_PER_YARD = 36;
export const GRAMS_PER_POUND = 453.59237;
/** A pound ÷ 16, exact. */
export const GRAMS_PER_OUNCE = 28.349523125;
export const OUNCES_PER_POUND = 16;
/** 1 m² in square inches: 1 ÷ 0.0254² = 1550.0031… */
export const SQ_IN_PER_SQ_M = 1 / (0.0254 * 0.0254);
/** 1 oz/yd² in g/m²: 28.349523125 ÷ 0.9144² = 33.9057475… */
export const GSM_PER_OZ_PER_SQ_YD = GRAMS_PER_OUNCE / (0.9144 * 0.9144);

export const gramsToOunces = (grams: number): number => grams / GRAMS_PER_OUNCE;
export const ouncesToGrams = (ounces: number): number => ounces * GRAMS_PER_OUNCE;
export const gramsToPounds = (grams: number): number => grams / GRAMS_PER_POUND;
export const poundsToGrams = (pounds: number): number => pounds * GRAMS_PER_POUND;
export const mmToInches = (mm: number): number => mm / MM_PER_INCH;
export const inchesToMm = (inches: number): number => inches * MM_PER_INCH;
export const gsmToOzPerSqYd = (gsm: number): number => gsm / GSM_PER_OZ_PER_SQ_YD;
export const ozPerSqYdToGsm = (ozPerSqYd: number): number => ozPerSqYd * GSM_PER_OZ_PER_SQ_YD;

/* ---------- exact rationals (internal) ---------- */

interface Ratio {
  num: bigint;
  den: bigint;
}

const ratio = (num: bigint, den: bigint): Ratio => ({ num, den });
const times = (a: Ratio, b: Ratio): Ratio => ratio(a.num * b.num, a.den * b.den);
const plus = (a: Ratio, b: Ratio): Ratio => ratio(a.num * b.den + b.num * a.den, a.den * b.den);

/** Round a non-negative ratio half up to an integer. */
function roundRatio(r: Ratio): number {
  return Number((2n * r.num + r.den) / (2n * r.den));
}

/** "12", "2.5", ".5", "1e-3" as an exact ratio; the decimal a member typed is what they meant. */
function decimalRatio(text: string): Ratio | null {
  const m = /^(\d*)(?:\.(\d*))?(?:e([+-]?\d+))?$/i.exec(text);
  if (!m || (m[1] === '' && (m[2] ?? '') === '')) return null;
  const fraction = m[2] ?? '';
  const exponent = Number(m[3] ?? '0') - fraction.length;
  const digits = BigInt((m[1] ?? '') + fraction || '0');
  return exponent >= 0 ? ratio(digits * 10n ** BigInt(exponent), 1n) : ratio(digits, 10n ** BigInt(-exponent));
}

/** A finite non-negative number as the exact decimal it prints as (2.375 → 2375/1000). */
function numberRatio(value: number): Ratio {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`Expected a non-negative number, got ${value}`);
  const r = decimalRatio(String(value));
  if (!r) throw new RangeError(`Cannot read ${value} as a decimal`);
  return r;
}

const VULGAR_FRACTIONS: Readonly<Record<string, Ratio>> = {
  '½': ratio(1n, 2n),
  '¼': ratio(1n, 4n),
  '¾': ratio(3n, 4n),
  '⅛': ratio(1n, 8n),
  '⅜': ratio(3n, 8n),
  '⅝': ratio(5n, 8n),
  '⅞': ratio(7n, 8n),
  '⅓': ratio(1n, 3n),
  '⅔': ratio(2n, 3n),
};

/**
 * A non-negative quantity as members write it: "2.5", "2½", "2 1/2", "2-1/2", "1/2", "½".
 * Commas are refused: "1,5" and "1,500" mean different things in different places.
 */
function parseQuantity(raw: string): Ratio | null {
  const text = raw.trim();
  const decimal = decimalRatio(text);
  if (decimal) return decimal;
  const vulgar = /^(\d+)?\s*([½¼¾⅛⅜⅝⅞⅓⅔])$/.exec(text);
  if (vulgar) {
    const part = VULGAR_FRACTIONS[vulgar[2] ?? ''];
    if (!part) return null;
    return plus(ratio(BigInt(vulgar[1] ?? '0'), 1n), part);
  }
  const fraction = /^(?:(\d+)(?:\s+|\s*-\s*))?(\d+)\s*\/\s*(\d+)$/.exec(text);
  if (fraction) {
    const den = BigInt(fraction[3] ?? '0');
    if (den === 0n) return null;
    return plus(ratio(BigInt(fraction[1] ?? '0'), 1n), ratio(BigInt(fraction[2] ?? '0'), den));
  }
  return null;
}

/* ---------- weights ---------- */

type WeightUnit = 'g' | 'kg' | 'oz' | 'lb';
const GRAMS_PER_UNIT: Readonly<Record<WeightUnit, Ratio>> = {
  g: ratio(1n, 1n),
  kg: ratio(1000n, 1n),
  lb: ratio(45359237n, 100000n),
  oz: ratio(28349523125n, 1000000000n),
};
const WEIGHT_UNIT_WORDS: ReadonlyArray<[RegExp, WeightUnit]> = [
  [/^(kg|kgs|kilos?|kilograms?)$/i, 'kg'],
  [/^(g|gr|grams?)$/i, 'g'],
  [/^(lb|lbs|pounds?|#)$/i, 'lb'],
  [/^(oz|ounces?)$/i, 'oz'],
];
const METRIC_WEIGHT: ReadonlySet<WeightUnit> = new Set(['g', 'kg']);

/**
 * Split "2 lb 3 oz" into [["2", "lb"], ["3", "oz"]]: each term is a quantity followed by a
 * unit word; a trailing quantity without a unit comes back with a null unit.
 */
function splitTerms(text: string): Array<[string, string | null]> | null {
  const parts = text.trim().split(/([a-z]+|#|''|"|″)/i);
  const terms: Array<[string, string | null]> = [];
  for (let i = 0; i + 1 < parts.length; i += 2) terms.push([(parts[i] ?? '').trim(), parts[i + 1] ?? '']);
  const tail = (parts[parts.length - 1] ?? '').trim();
  if (tail) terms.push([tail, null]);
  return terms.length > 0 ? terms : null;
}

export interface ParseWeightOptions {
  /** Unit for a number typed without one; without this option such input is refused. */
  bareUnit?: WeightUnit;
}

/**
 * Parse a weight such as "2 lb 3 oz", "2lb3oz", "1.5 kg", "350 g", "12 oz", "¾ lb" into
 * integer grams (round half up). Refuses empty input, negative or unreadable numbers,
 * a unit used twice, and metric mixed with imperial. Returns null when refused.
 */
export function parseWeightToGrams(input: string, options: ParseWeightOptions = {}): number | null {
  const terms = splitTerms(input);
  if (!terms) return null;
  const seen = new Set<WeightUnit>();
  let total = ratio(0n, 1n);
  for (const [quantityText, unitWord] of terms) {
    const unit = unitWord === null ? options.bareUnit : WEIGHT_UNIT_WORDS.find(([re]) => re.test(unitWord))?.[1];
    const quantity = parseQuantity(quantityText);
    if (!unit || !quantity || seen.has(unit)) return null;
    seen.add(unit);
    total = plus(total, times(quantity, GRAMS_PER_UNIT[unit]));
  }
  const systems = new Set([...seen].map((u) => METRIC_WEIGHT.has(u)));
  if (systems.size > 1) return null;
  return roundRatio(total);
}

/* ---------- lengths ---------- */

type LengthUnit = 'mm' | 'cm' | 'm' | 'in' | 'yd';
const MM_PER_UNIT: Readonly<Record<LengthUnit, Ratio>> = {
  mm: ratio(1n, 1n),
  cm: ratio(10n, 1n),
  m: ratio(1000n, 1n),
  in: ratio(254n, 10n),
  yd: ratio(9144n, 10n),
};
const LENGTH_UNIT_WORDS: ReadonlyArray<[RegExp, LengthUnit]> = [
  [/^(mm|millimet(er|re)s?)$/i, 'mm'],
  [/^(cm|centimet(er|re)s?)$/i, 'cm'],
  [/^(m|met(er|re)s?)$/i, 'm'],
  [/^(in|ins|inch|inches|"|''|″)$/i, 'in'],
  [/^(yd|yds|yards?)$/i, 'yd'],
];

export interface ParseLengthOptions {
  /** Unit for a number typed without one; inches by default, the quilter's habit. */
  bareUnit?: LengthUnit;
}

/**
 * Parse one length such as "2½", "2 1/2", "2-1/2 in", "2.5\"", "6.4 cm", "64 mm", "1 yd"
 * into integer millimetres (round half up). A bare number is inches unless `bareUnit`
 * says otherwise. Returns null when the input is not a single readable length.
 */
export function parseLengthToMm(input: string, options: ParseLengthOptions = {}): number | null {
  const terms = splitTerms(input);
  if (!terms || terms.length !== 1) return null;
  const [quantityText, unitWord] = terms[0] ?? ['', null];
  const unit =
    unitWord === null ? (options.bareUnit ?? 'in') : LENGTH_UNIT_WORDS.find(([re]) => re.test(unitWord))?.[1];
  const quantity = parseQuantity(quantityText);
  if (!unit || !quantity) return null;
  return roundRatio(times(quantity, MM_PER_UNIT[unit]));
}

/* ---------- formatting ---------- */

const EIGHTHS_GLYPHS = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'] as const;

/** A count of eighths as a mixed number: 20 → "2½", 4 → "½", 0 → "0". */
export function formatEighths(eighths: number): string {
  if (!Number.isInteger(eighths) || eighths < 0) throw new RangeError(`Expected whole eighths, got ${eighths}`);
  const whole = Math.floor(eighths / 8);
  const glyph = EIGHTHS_GLYPHS[eighths % 8] ?? '';
  if (whole === 0) return glyph || '0';
  return `${whole}${glyph}`;
}

/** Millimetres to the nearest eighth of an inch (round half up). */
export function mmToEighthsOfInch(mm: number): number {
  return roundRatio(times(numberRatio(mm), ratio(80n, 254n)));
}

export interface FormatLengthOptions {
  /** Metric lengths show in cm by default (how metric patterns give cuts); "mm" shows mm. */
  metricUnit?: 'cm' | 'mm';
}

/**
 * A length for display: imperial to the nearest ⅛ in ("2½ in"); metric in centimetres to
 * one decimal ("6.4 cm") or whole millimetres ("64 mm").
 */
export function formatLength(mm: number, system: UnitSystem, options: FormatLengthOptions = {}): string {
  if (system === 'imperial') return `${formatEighths(mmToEighthsOfInch(mm))} in`;
  const wholeMm = roundRatio(numberRatio(mm));
  if (options.metricUnit === 'mm') return `${wholeMm} mm`;
  return `${trimDecimal(wholeMm, 1)} cm`;
}

/** An integer count of tenths/hundredths as a decimal without trailing zeros: (64, 1) → "6.4". */
function trimDecimal(scaled: number, decimals: number): string {
  const factor = 10 ** decimals;
  const whole = Math.floor(scaled / factor);
  const fraction = String(scaled % factor).padStart(decimals, '0').replace(/0+$/, '');
  return fraction ? `${whole}.${fraction}` : String(whole);
}

/**
 * A weight for display. Imperial: whole ounces under a pound ("12 oz"), tenths under an
 * ounce ("0.4 oz"), pounds and whole ounces above ("1 lb 4 oz", "2 lb"). Metric: whole grams
 * under a kilogram ("350 g"), kilograms to one decimal above ("1.2 kg", "2 kg").
 * Every step rounds half up.
 */
export function formatWeight(grams: number, system: UnitSystem): string {
  const g = numberRatio(grams);
  if (system === 'metric') {
    const wholeGrams = roundRatio(g);
    if (wholeGrams < 1000) return `${wholeGrams} g`;
    return `${trimDecimal(roundRatio(times(g, ratio(1n, 100n))), 1)} kg`;
  }
  const ounces = times(g, ratio(GRAMS_PER_UNIT.oz.den, GRAMS_PER_UNIT.oz.num));
  const wholeOunces = roundRatio(ounces);
  if (wholeOunces < 1 && grams > 0) return `${trimDecimal(roundRatio(times(ounces, ratio(10n, 1n))), 1)} oz`;
  if (wholeOunces < OUNCES_PER_POUND) return `${wholeOunces} oz`;
  const pounds = Math.floor(wholeOunces / OUNCES_PER_POUND);
  const rest = wholeOunces % OUNCES_PER_POUND;
  return rest === 0 ? `${pounds} lb` : `${pounds} lb ${rest} oz`;
}

/**
 * A postage weight: ounces to a tenth (pounds and ounces from a pound up), or whole grams. A weight the
 * carrier bills by is rounded `up`, so "billed as" never reads lighter than the band it falls in
 * (230 g is 8.2 oz up, where the nearest whole ounce would say 8 oz and look like the 8 oz band).
 */
export function formatPostalWeight(grams: number, system: UnitSystem, round: 'up' | 'nearest' = 'nearest'): string {
  const g = numberRatio(grams);
  const toInteger = (r: Ratio) => (round === 'up' ? Number((r.num + r.den - 1n) / r.den) : roundRatio(r));
  if (system === 'metric') return `${toInteger(g).toLocaleString('en-US')} g`;
  const tenths = toInteger(times(g, ratio(10n * GRAMS_PER_UNIT.oz.den, GRAMS_PER_UNIT.oz.num)));
  const poundTenths = OUNCES_PER_POUND * 10;
  if (tenths < poundTenths) return `${trimDecimal(tenths, 1)} oz`;
  const pounds = Math.floor(tenths / poundTenths);
  const rest = tenths % poundTenths;
  return rest === 0 ? `${pounds} lb` : `${pounds} lb ${trimDecimal(rest, 1)} oz`;
}

/* ---------- money ---------- */

/** ISO 4217 minor units of the guild currencies we list; others are asked of Intl. */
export const CURRENCY_MINOR_UNITS: Readonly<Record<string, number>> = {
  USD: 2,
  CAD: 2,
  GBP: 2,
  EUR: 2,
  AUD: 2,
  NZD: 2,
  JPY: 0,
};

/** Decimal places of a currency's minor unit (2 for USD, 0 for JPY). */
export function currencyMinorUnits(currency: string): number {
  const code = currency.toUpperCase();
  const known = CURRENCY_MINOR_UNITS[code];
  if (known !== undefined) return known;
  return new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** Integer minor units for display, e.g. (1200, "USD") → "$12.00", (1200, "JPY") → "¥1,200". */
export function formatMoney(minor: number, currency: string, locale = 'en-US'): string {
  if (!Number.isInteger(minor)) throw new RangeError(`Money must be whole minor units, got ${minor}`);
  const digits = currencyMinorUnits(currency);
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency: currency.toUpperCase(),
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(minor / 10 ** digits);
}

/**
 * A typed price ("12", "12.5", "$12.50") as integer minor units. Refuses more decimals
 * than the currency has, negatives, and commas. Returns null when refused.
 */
export function parseMoneyToMinor(input: string, currency: string): number | null {
  const digits = currencyMinorUnits(currency);
  const m = /^\s*[$£€¥]?\s*(\d+)(?:\.(\d*))?\s*$/.exec(input);
  if (!m) return null;
  const fraction = m[2] ?? '';
  if (fraction.length > digits) return null;
  return Number(m[1]) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
}
