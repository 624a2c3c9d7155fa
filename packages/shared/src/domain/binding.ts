/**
 * Binding and seam-allowance arithmetic, in inches (quilters measure binding in inches;
 * the values are exact eighths, which binary floating point holds exactly).
 *
 * Double-fold binding (common practice): strips cut across the width of fabric, joined
 * end to end with 45° seams, pressed in half lengthwise.
 *   strips       = ceil((2 × (W + L) + allowance) ÷ usable width)
 *   fabric       = strips × strip width, bought in ⅛-yd steps (rounded up)
 *   joined length = n × usable − (n − 1) × strip width (a 45° join laid square uses one
 *                   strip width of length; geometry)
 */
import { INCHES_PER_YARD } from './units.ts';

export interface BindingInput {
  quiltWidthIn: number;
  quiltLengthIn: number;
  /** Extra length for corners and the final join; 10 in by default (common practice). */
  allowanceIn?: number;
  /** Usable width of fabric; 42 in by default. */
  usableWidthIn?: number;
  /** Cut width of each strip; 2½ in by default (2¼ is also common). */
  stripWidthIn?: number;
}

export interface BindingPlan {
  perimeterIn: number;
  /** Perimeter plus allowance. */
  lengthNeededIn: number;
  strips: number;
  /**
   * True when the formula's strip count fell short once the 45° joins were taken off and
   * one more strip was added; the formula alone ignores the joins.
   */
  extraStripForJoins: boolean;
  joinedLengthIn: number;
  /** Fabric length to cut the strips, inches. */
  fabricIn: number;
  /** Fabric to buy in eighths of a yard (4 → ½ yd); see formatEighths. */
  fabricEighthsOfYard: number;
  fabricYards: number;
}

const EIGHTH_YARD_IN = INCHES_PER_YARD / 8;

export const joinedBindingLengthIn = (strips: number, usableWidthIn: number, stripWidthIn: number): number =>
  strips * usableWidthIn - Math.max(0, strips - 1) * stripWidthIn;

export function planBinding(input: BindingInput): BindingPlan {
  const allowanceIn = input.allowanceIn ?? 10;
  const usableWidthIn = input.usableWidthIn ?? 42;
  const stripWidthIn = input.stripWidthIn ?? 2.5;
  for (const [name, value] of Object.entries({ ...input, allowanceIn, usableWidthIn, stripWidthIn })) {
    if (!Number.isFinite(value) || value < 0) throw new RangeError(`Bad ${name}: ${value}`);
  }
  if (usableWidthIn <= stripWidthIn) throw new RangeError('Usable width must exceed the strip width');

  const perimeterIn = 2 * (input.quiltWidthIn + input.quiltLengthIn);
  const lengthNeededIn = perimeterIn + allowanceIn;
  const formulaStrips = Math.ceil(lengthNeededIn / usableWidthIn);
  let strips = formulaStrips;
  while (joinedBindingLengthIn(strips, usableWidthIn, stripWidthIn) < lengthNeededIn) strips++;
  const fabricIn = strips * stripWidthIn;
  const fabricEighthsOfYard = Math.ceil(fabricIn / EIGHTH_YARD_IN);
  return {
    perimeterIn,
    lengthNeededIn,
    strips,
    extraStripForJoins: strips > formulaStrips,
    joinedLengthIn: joinedBindingLengthIn(strips, usableWidthIn, stripWidthIn),
    fabricIn,
    fabricEighthsOfYard,
    fabricYards: fabricEighthsOfYard / 8,
  };
}

/** Cut size of a square or strip for a finished size: + ½ in (two ¼-in seam allowances). */
export const cutSizeForFinishedIn = (finishedIn: number): number => finishedIn + 0.5;

/** Cut square for half-square triangles (two at a time): finished + ⅞ in. */
export const halfSquareTriangleCutSizeIn = (finishedIn: number): number => finishedIn + 0.875;
