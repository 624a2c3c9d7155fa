/**
 * Yield estimate of a scrap bag from its weight and fibre (design choice; no published
 * rule exists):
 *
 *   usable area (in²) = grams ÷ fabric weight (g/m²) × 1550.0031 in²/m² × (1 − waste)
 *
 * Counts are equivalents of that area (area ÷ cut area, rounded down): they say how much
 * fabric there is, not that every piece is big enough for the cut. Listed pieces get an
 * exact cut plan instead (cut-plan.ts).
 */
import { FIBRE_TYPICAL_GSM, type Fibre } from './fibres.ts';
import { INCHES_PER_YARD, MM_PER_INCH, SQ_IN_PER_SQ_M } from './units.ts';

/**
 * Share of a scrap bag's area we assume cannot be cut into standard pieces (design
 * choice): irregular shapes, seam-allowance trims, selvages and slivers. A quarter keeps
 * the estimate modest; a member who finds more is pleased, not let down.
 */
export const SCRAP_BAG_WASTE = 0.25;

/** Usable width of fabric between selvages, inches (CHECKS.md: usable 40–42, default 42). */
export const DEFAULT_USABLE_WIDTH_IN = 42;

const STRIP_WIDTH_IN = 2.5;
const CM2_PER_SQ_IN = 6.4516;

export interface YieldInput {
  grams: number;
  /** Fibre whose typical fabric weight is used, unless `gsm` is given. */
  fibre?: Fibre;
  /** Fabric weight in g/m² when known; overrides the fibre's typical weight. */
  gsm?: number;
  /** Share of area lost, 0 ≤ waste < 1; defaults to SCRAP_BAG_WASTE. */
  waste?: number;
  /** Width of fabric for the yards and strip figures; defaults to 42 in. */
  usableWidthIn?: number;
}

export interface YieldEstimate {
  gsm: number;
  waste: number;
  usableWidthIn: number;
  /** Usable area, whole square inches (rounded half up). */
  areaSqIn: number;
  /** Usable area, whole square centimetres (rounded half up). */
  areaCm2: number;
  /** Length of fabric at the usable width that has this area, to 0.01 yd. */
  linearYards: number;
  /** The same length in whole millimetres. */
  lengthMm: number;
  /** 2½-in strips across the usable width (rounded down). */
  stripEquivalents: number;
  /** 5-in squares (rounded down). */
  fiveInchSquares: number;
  /** 2½-in squares (rounded down). */
  twoAndHalfInchSquares: number;
  /** 10-in squares (rounded down). */
  tenInchSquares: number;
}

export function estimateYield(input: YieldInput): YieldEstimate {
  const gsm = input.gsm ?? FIBRE_TYPICAL_GSM[input.fibre ?? 'mixed_unknown'];
  const waste = input.waste ?? SCRAP_BAG_WASTE;
  const usableWidthIn = input.usableWidthIn ?? DEFAULT_USABLE_WIDTH_IN;
  if (!(input.grams >= 0) || !Number.isFinite(input.grams)) throw new RangeError(`Bad weight ${input.grams}`);
  if (!(gsm > 0)) throw new RangeError(`Bad fabric weight ${gsm}`);
  if (!(waste >= 0 && waste < 1)) throw new RangeError(`Waste must be in [0, 1), got ${waste}`);
  if (!(usableWidthIn > 0)) throw new RangeError(`Bad usable width ${usableWidthIn}`);

  const area = (input.grams / gsm) * SQ_IN_PER_SQ_M * (1 - waste);
  const lengthIn = area / usableWidthIn;
  return {
    gsm,
    waste,
    usableWidthIn,
    areaSqIn: Math.round(area),
    areaCm2: Math.round(area * CM2_PER_SQ_IN),
    linearYards: Math.round((lengthIn / INCHES_PER_YARD) * 100) / 100,
    lengthMm: Math.round(lengthIn * MM_PER_INCH),
    stripEquivalents: Math.floor(area / (STRIP_WIDTH_IN * usableWidthIn)),
    fiveInchSquares: Math.floor(area / 25),
    twoAndHalfInchSquares: Math.floor(area / 6.25),
    tenInchSquares: Math.floor(area / 100),
  };
}
