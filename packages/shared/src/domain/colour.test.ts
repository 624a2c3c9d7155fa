import { describe, expect, it } from 'vitest';
import {
  type Rgb,
  averageColour,
  colourFamilyOf,
  colourValueFromLStar,
  contrastRatio,
  encodeSrgb,
  hueAndSaturation,
  lStarFromLuminance,
  linearise,
  parseHex,
  relativeLuminance,
  suggestColour,
  toHex,
} from './colour.ts';

const hex = (h: string): Rgb => {
  const rgb = parseHex(h);
  if (!rgb) throw new Error(`bad hex ${h}`);
  return rgb;
};

describe('relative luminance and contrast (W3C WCAG 2.2)', () => {
  it.each([
    ['#FFFFFF', 1.0],
    ['#000000', 0.0],
    ['#777777', 0.184475],
    ['#808080', 0.215861],
  ])('%s → %f (tolerance 1e-6)', (h, expected) => {
    expect(Math.abs(relativeLuminance(hex(h)) - expected)).toBeLessThan(1e-6);
  });

  it('contrast ratio of white on black is 21, and the same either way round', () => {
    expect(contrastRatio(hex('#fff'), hex('#000'))).toBeCloseTo(21, 10);
    expect(contrastRatio(hex('#000'), hex('#fff'))).toBeCloseTo(21, 10);
    expect(contrastRatio(hex('#777'), hex('#777'))).toBe(1);
  });

  it('encodes linear light back to the same 8-bit channel', () => {
    for (let c = 0; c <= 255; c++) expect(encodeSrgb(linearise(c))).toBe(c);
  });
});

describe('CIE 1976 L* and value classes (value classes: design choice, thirds of L*)', () => {
  it('#777777 → L* 50.03, medium', () => {
    const lStar = lStarFromLuminance(relativeLuminance(hex('#777777')));
    expect(lStar).toBeCloseTo(50.03, 2);
    expect(colourValueFromLStar(lStar)).toBe('medium');
  });

  it('#FFFFFF → 100, light; #000000 → 0, dark', () => {
    expect(lStarFromLuminance(1)).toBeCloseTo(100, 10);
    expect(colourValueFromLStar(100)).toBe('light');
    expect(lStarFromLuminance(0)).toBe(0);
    expect(colourValueFromLStar(0)).toBe('dark');
  });

  it('uses the linear segment below L = 0.008856 (CIE 1976)', () => {
    expect(lStarFromLuminance(0.008)).toBeCloseTo(903.3 * 0.008, 10);
  });

  it('draws the class lines at 33⅓ and 66⅔', () => {
    expect(colourValueFromLStar(33.33)).toBe('dark');
    expect(colourValueFromLStar(100 / 3)).toBe('medium');
    expect(colourValueFromLStar(66.66)).toBe('medium');
    expect(colourValueFromLStar(200 / 3)).toBe('light');
  });
});

describe('hue → colour family (design choice)', () => {
  it('computes HSV hue and saturation', () => {
    expect(hueAndSaturation(hex('#ff0000'))).toEqual({ hue: 0, saturation: 1 });
    expect(hueAndSaturation(hex('#00ff00')).hue).toBe(120);
    expect(hueAndSaturation(hex('#0000ff')).hue).toBe(240);
    expect(hueAndSaturation(hex('#ff00ff')).hue).toBe(300);
    expect(hueAndSaturation(hex('#808080'))).toEqual({ hue: 0, saturation: 0 });
  });

  it.each([
    ['#c0392b', 'warm'], // brick red, hue 6°
    ['#e67e22', 'warm'], // orange, 28°
    ['#f1c40f', 'warm'], // yellow, 48°
    ['#b03a7a', 'warm'], // berry, 327°
    ['#27ae60', 'cool'], // green, 145°
    ['#2f6690', 'cool'], // blue, 206°
    ['#6c3483', 'cool'], // purple, 282°
    ['#8a8178', 'neutral'], // taupe, saturation 0.13
    ['#777777', 'neutral'],
    ['#111111', 'black_white'],
    ['#f4f4f0', 'black_white'],
  ])('%s is %s', (h, family) => {
    expect(colourFamilyOf(hex(h))).toBe(family);
  });
});

describe('averageColour (design choice: average linear light, then re-encode)', () => {
  it('averages black and white to the mid grey the eye sees, #bcbcbc, not #808080', () => {
    expect(averageColour([0, 0, 0, 255, 255, 255], 3)).toEqual({ r: 188, g: 188, b: 188 });
  });

  it('returns a single colour unchanged', () => {
    expect(averageColour(new Uint8Array([12, 200, 77, 12, 200, 77]), 3)).toEqual({ r: 12, g: 200, b: 77 });
  });

  it('skips fully transparent RGBA pixels and returns null when nothing counts', () => {
    expect(averageColour([255, 0, 0, 255, 0, 0, 255, 0], 4)).toEqual({ r: 255, g: 0, b: 0 });
    expect(averageColour([255, 0, 0, 0], 4)).toBeNull();
    expect(() => averageColour([1, 2], 3)).toThrow(RangeError);
  });
});

describe('suggestColour', () => {
  it('suggests value, family, hex and L* from an average colour', () => {
    expect(suggestColour(hex('#777777'))).toEqual({ value: 'medium', family: 'neutral', hex: '#777777', lStar: 50.03 });
    expect(suggestColour(hex('#1b2a4a'))).toMatchObject({ value: 'dark', family: 'cool', hex: '#1b2a4a' });
    expect(suggestColour(hex('#f9d5c2'))).toMatchObject({ value: 'light', family: 'warm' });
  });

  it('reads and writes hex colours', () => {
    expect(parseHex('#777')).toEqual({ r: 119, g: 119, b: 119 });
    expect(parseHex('nope')).toBeNull();
    expect(toHex({ r: 27, g: 42, b: 74 })).toBe('#1b2a4a');
  });
});
