import { describe, expect, it } from 'vitest';
import {
  formatPostalWeight,
  GRAMS_PER_OUNCE,
  GRAMS_PER_POUND,
  GSM_PER_OZ_PER_SQ_YD,
  MM_PER_INCH,
  MM_PER_YARD,
  SQ_IN_PER_SQ_M,
  currencyMinorUnits,
  formatEighths,
  formatLength,
  formatMoney,
  formatWeight,
  gramsToOunces,
  gramsToPounds,
  gsmToOzPerSqYd,
  inchesToMm,
  mmToEighthsOfInch,
  mmToInches,
  ouncesToGrams,
  ozPerSqYdToGsm,
  parseLengthToMm,
  parseMoneyToMinor,
  parseWeightToGrams,
  poundsToGrams,
} from './units.ts';

describe('exact factors (NIST SP 811 appendix B, 1959 international yard and pound)', () => {
  it('defines the inch, yard, pound and ounce exactly', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(MM_PER_YARD).toBe(914.4);
    expect(GRAMS_PER_POUND).toBe(453.59237);
    expect(GRAMS_PER_OUNCE).toBe(28.349523125);
    expect(GRAMS_PER_OUNCE * 16).toBe(GRAMS_PER_POUND);
  });

  it('converts 42 in → 106.68 cm, 8 oz → 226.796185 g, 2 lb → 907.18474 g (CHECKS.md, NIST SP 811)', () => {
    expect(inchesToMm(42) / 10).toBeCloseTo(106.68, 10);
    expect(ouncesToGrams(8)).toBeCloseTo(226.796185, 9);
    expect(poundsToGrams(2)).toBeCloseTo(907.18474, 9);
    expect(mmToInches(25.4)).toBe(1);
    expect(gramsToOunces(226.796185)).toBeCloseTo(8, 12);
    expect(gramsToPounds(907.18474)).toBeCloseTo(2, 12);
  });

  it('1 m² = 1550.0031 in² and 1 oz/yd² = 33.9057475 g/m² (CHECKS.md, NIST SP 811)', () => {
    expect(SQ_IN_PER_SQ_M).toBeCloseTo(1550.0031, 4);
    expect(GSM_PER_OZ_PER_SQ_YD).toBeCloseTo(33.9057475, 6);
    expect(ozPerSqYdToGsm(1)).toBeCloseTo(33.9057475, 6);
  });

  it('140 g/m² quilting cotton is 4.1291 oz/yd² (CHECKS.md, tolerance 1e-3)', () => {
    expect(Math.abs(gsmToOzPerSqYd(140) - 4.1291)).toBeLessThan(1e-3);
  });
});

describe('parseWeightToGrams (round half up, design choice)', () => {
  it.each([
    ['350 g', 350],
    ['1.5 kg', 1500],
    ['12 oz', 340], // 12 × 28.349523125 = 340.1943 (NIST SP 811 factor)
    ['2 lb 3 oz', 992], // 907.18474 + 85.048569375 = 992.2333
    ['2lb3oz', 992],
    ['2 pounds 3 ounces', 992],
    ['¾ lb', 340], // 340.1943
    ['1 1/2 lb', 680], // 680.388555
    ['2 #', 907],
    ['0 g', 0],
  ])('reads %s as %i g', (text, grams) => {
    expect(parseWeightToGrams(text)).toBe(grams);
  });

  it('rounds an exact half up, without float noise (1.0005 kg = 1000.5 g → 1001 g)', () => {
    expect(parseWeightToGrams('1.0005 kg')).toBe(1001);
    expect(parseWeightToGrams('0.4995 kg')).toBe(500);
    expect(parseWeightToGrams('1.0004 kg')).toBe(1000);
  });

  it.each(['', 'kg', 'heavy', '-2 kg', '1 kg 3 oz', '2 lb 3 lb', '1,5 kg', '2 lb 3', '2 stone'])('refuses %j', (text) => {
    expect(parseWeightToGrams(text)).toBeNull();
  });

  it('reads a bare number only when told its unit', () => {
    expect(parseWeightToGrams('350')).toBeNull();
    expect(parseWeightToGrams('350', { bareUnit: 'g' })).toBe(350);
    expect(parseWeightToGrams('2 lb 3', { bareUnit: 'oz' })).toBe(992);
  });
});

describe('parseLengthToMm (round half up, design choice)', () => {
  it.each([
    ['2½', 64], // 63.5 mm, the half rounds up
    ['2 1/2', 64],
    ['2-1/2', 64],
    ['2.5', 64],
    ['2.5"', 64],
    ['2 1/2 in', 64],
    ['5 inches', 127],
    ['6.4 cm', 64],
    ['64 mm', 64],
    ['1 yd', 914], // 914.4
    ['⅞', 22], // 22.225
    ['0.1 m', 100],
  ])('reads %s as %i mm', (text, mm) => {
    expect(parseLengthToMm(text)).toBe(mm);
  });

  it('never stores a multiple of 2½ in below its exact length', () => {
    for (let k = 1; k <= 40; k++) {
      const mm = parseLengthToMm(String(2.5 * k));
      expect(mm).not.toBeNull();
      expect(mm ?? 0).toBeGreaterThanOrEqual(63.5 * k);
    }
  });

  it('takes a bare number as inches unless told otherwise', () => {
    expect(parseLengthToMm('42')).toBe(1067);
    expect(parseLengthToMm('6.4', { bareUnit: 'cm' })).toBe(64);
  });

  it.each(['', 'wide', '2 in 3 in', '1/0', '-2 in', '2 furlongs', '2,5 cm'])('refuses %j', (text) => {
    expect(parseLengthToMm(text)).toBeNull();
  });
});

describe('formatting', () => {
  it('writes eighths as mixed numbers', () => {
    expect(formatEighths(20)).toBe('2½');
    expect(formatEighths(4)).toBe('½');
    expect(formatEighths(0)).toBe('0');
    expect(formatEighths(7)).toBe('⅞');
    expect(formatEighths(17)).toBe('2⅛');
    expect(formatEighths(22)).toBe('2¾');
  });

  it('shows imperial lengths to the nearest ⅛ in', () => {
    expect(mmToEighthsOfInch(63.5)).toBe(20);
    expect(formatLength(64, 'imperial')).toBe('2½ in');
    expect(formatLength(127, 'imperial')).toBe('5 in');
    expect(formatLength(1067, 'imperial')).toBe('42 in');
    expect(formatLength(3, 'imperial')).toBe('⅛ in');
  });

  it('shows metric lengths in cm by default, or mm', () => {
    expect(formatLength(64, 'metric')).toBe('6.4 cm');
    expect(formatLength(60, 'metric')).toBe('6 cm');
    expect(formatLength(64, 'metric', { metricUnit: 'mm' })).toBe('64 mm');
    expect(formatLength(63.5, 'metric', { metricUnit: 'mm' })).toBe('64 mm');
  });

  it('shows imperial weights in ounces and pounds', () => {
    expect(formatWeight(340, 'imperial')).toBe('12 oz');
    expect(formatWeight(567, 'imperial')).toBe('1 lb 4 oz'); // 20.0 oz
    expect(formatWeight(907, 'imperial')).toBe('2 lb'); // 31.99 oz → 32
    expect(formatWeight(10, 'imperial')).toBe('0.4 oz'); // 0.353 oz
    expect(formatWeight(0, 'imperial')).toBe('0 oz');
  });

  it('shows metric weights in grams below a kilogram and kilograms above', () => {
    expect(formatWeight(350, 'metric')).toBe('350 g');
    expect(formatWeight(1200, 'metric')).toBe('1.2 kg');
    expect(formatWeight(1250, 'metric')).toBe('1.3 kg'); // half up
    expect(formatWeight(2000, 'metric')).toBe('2 kg');
  });
});

describe('postal weights (1 oz = 28.349523125 g exactly, 1959 international yard and pound; rounding up for billing is a design choice)', () => {
  it('gives ounces to a tenth, rounding a billed weight up so it never reads lighter than its band', () => {
    expect(formatPostalWeight(215, 'imperial')).toBe('7.6 oz'); // 7.584 oz
    expect(formatPostalWeight(230, 'imperial', 'up')).toBe('8.2 oz'); // 8.113 oz
    expect(formatPostalWeight(230, 'imperial')).toBe('8.1 oz');
    expect(formatPostalWeight(227, 'imperial', 'up')).toBe('8.1 oz'); // 8.007 oz: just over an 8 oz band
  });
  it('gives pounds and ounces from a pound up, and whole grams for metric', () => {
    expect(formatPostalWeight(454, 'imperial')).toBe('1 lb'); // 16.014 oz
    expect(formatPostalWeight(454, 'imperial', 'up')).toBe('1 lb 0.1 oz');
    expect(formatPostalWeight(1000, 'imperial')).toBe('2 lb 3.3 oz'); // 35.274 oz
    expect(formatPostalWeight(1000, 'metric')).toBe('1,000 g');
    expect(formatPostalWeight(229.4, 'metric', 'up')).toBe('230 g');
  });
});

describe('money formatting (ISO 4217 minor units)', () => {
  it('knows the minor units of the guild currencies', () => {
    for (const code of ['USD', 'CAD', 'GBP', 'EUR', 'AUD', 'NZD']) expect(currencyMinorUnits(code)).toBe(2);
    expect(currencyMinorUnits('JPY')).toBe(0);
    expect(currencyMinorUnits('KWD')).toBe(3); // asked of Intl, ISO 4217
  });

  it('formats minor units through Intl.NumberFormat', () => {
    expect(formatMoney(1200, 'USD')).toBe('$12.00');
    expect(formatMoney(1135, 'GBP', 'en-GB')).toBe('£11.35');
    expect(formatMoney(1200, 'JPY')).toBe('¥1,200'); // ¥1200 is 1200 minor units (ISO 4217)
    expect(formatMoney(1200, 'EUR', 'de-DE')).toBe('12,00\u00a0€');
    expect(() => formatMoney(12.5, 'USD')).toThrow(RangeError);
  });

  it('parses typed prices into minor units', () => {
    expect(parseMoneyToMinor('12', 'USD')).toBe(1200);
    expect(parseMoneyToMinor('12.5', 'USD')).toBe(1250);
    expect(parseMoneyToMinor('$12.05', 'USD')).toBe(1205);
    expect(parseMoneyToMinor('1200', 'JPY')).toBe(1200);
    expect(parseMoneyToMinor('12.345', 'USD')).toBeNull();
    expect(parseMoneyToMinor('12.5', 'JPY')).toBeNull();
    expect(parseMoneyToMinor('-3', 'USD')).toBeNull();
    expect(parseMoneyToMinor('1,200', 'USD')).toBeNull();
  });
});
