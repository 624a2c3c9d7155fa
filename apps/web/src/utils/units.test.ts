import { describe, expect, it } from 'vitest';
import { basisPointsToPercentText, currencyExponent, majorTextToMinor, minorToMajorText, percentTextToBasisPoints } from './units.ts';

describe('percent ↔ basis points (1 % = 100 basis points, by definition)', () => {
  it('shows stored basis points as percent', () => {
    expect(basisPointsToPercentText(1000)).toBe('10');
    expect(basisPointsToPercentText(290)).toBe('2.9');
    expect(basisPointsToPercentText(5)).toBe('0.05');
    expect(basisPointsToPercentText(0)).toBe('0');
  });

  it('reads typed percent exactly, without float drift', () => {
    expect(percentTextToBasisPoints('10')).toBe(1000);
    expect(percentTextToBasisPoints('2.9')).toBe(290);
    expect(percentTextToBasisPoints('2,9')).toBe(290);
    expect(percentTextToBasisPoints('0.29')).toBe(29);
    expect(percentTextToBasisPoints(' 12.50 ')).toBe(1250);
  });

  it('refuses what is not a plain number, or finer than a basis point', () => {
    for (const text of ['', 'ten', '-1', '2.955', '1e3']) expect(percentTextToBasisPoints(text)).toBeNaN();
  });
});

describe('minor ↔ major currency units (minor-unit digits from ISO 4217: USD 2, GBP 2, JPY 0)', () => {
  it('knows how many decimals each currency has', () => {
    expect(currencyExponent('USD')).toBe(2);
    expect(currencyExponent('GBP')).toBe(2);
    expect(currencyExponent('JPY')).toBe(0);
  });

  it('shows minor units in the main unit', () => {
    expect(minorToMajorText(30, 'USD')).toBe('0.30');
    expect(minorToMajorText(1205, 'GBP')).toBe('12.05');
    expect(minorToMajorText(30, 'JPY')).toBe('30');
  });

  it('reads typed amounts back to minor units', () => {
    expect(majorTextToMinor('0.30', 'USD')).toBe(30);
    expect(majorTextToMinor('0.3', 'USD')).toBe(30);
    expect(majorTextToMinor('12', 'EUR')).toBe(1200);
    expect(majorTextToMinor('30', 'JPY')).toBe(30);
    expect(majorTextToMinor('30.0', 'JPY')).toBe(30);
    expect(majorTextToMinor('0.305', 'USD')).toBeNaN();
    expect(majorTextToMinor('30.5', 'JPY')).toBeNaN();
  });
});
