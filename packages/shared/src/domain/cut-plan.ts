/**
 * Cut plan for listed pieces: how many of each standard cut a rectangle gives with
 * straight guillotine cuts (common practice: floor(a/s) × floor(b/s)).
 *
 * Arithmetic is in integer micrometres so 2½ in is exactly 63 500 µm and floor() never
 * suffers float trouble. Drawing rectangles come back in millimetres and can be half
 * millimetres (63.5 mm); they are picture coordinates, not stored lengths.
 *
 * One plan per standard cut (no mixed plans): honest, easy to check by hand, and what a
 * member does with a rotary cutter. The suggested plan is the one that uses the most of
 * the piece.
 */

export const STANDARD_CUTS = ['strip_2_5in', 'square_2_5in', 'square_5in', 'square_10in'] as const;
export type StandardCut = (typeof STANDARD_CUTS)[number];

export const STANDARD_CUT_LABELS: Readonly<Record<StandardCut, string>> = {
  strip_2_5in: '2½-inch strips',
  square_2_5in: '2½-inch squares',
  square_5in: '5-inch squares',
  square_10in: '10-inch squares',
};

const UM_PER_MM = 1000;
const CUT_SIZE_UM: Readonly<Record<StandardCut, number>> = {
  strip_2_5in: 63_500,
  square_2_5in: 63_500,
  square_5in: 127_000,
  square_10in: 254_000,
};

/** Shortest strip worth counting (design choice): 10 in, about a block's width. */
export const MIN_STRIP_LENGTH_MM = 254;

export interface Piece {
  widthMm: number;
  heightMm: number;
  count: number;
}

/** One cut piece to draw, in millimetres from the piece's top-left corner. */
export interface CutRect {
  x: number;
  y: number;
  w: number;
  h: number;
  cut: StandardCut;
}

export interface CutResult {
  cut: StandardCut;
  /** Cuts from one piece. */
  count: number;
  /** Length of each strip (the piece's longer side), null for squares or when no strip fits. */
  stripLengthMm: number | null;
  /** Share of the piece's area the cuts use, 0–1. */
  utilisation: number;
  rects: CutRect[];
}

export interface PiecePlan {
  piece: Piece;
  plans: Record<StandardCut, CutResult>;
  /** The cut that uses the most of the piece (ties: the larger single cut), null if none fits. */
  suggested: StandardCut | null;
}

export interface BundleCutPlan {
  pieces: PiecePlan[];
  /** Cuts over all pieces, each piece's cuts times its count. */
  totals: Record<StandardCut, number>;
  /** Total length of all 2½-in strips, millimetres. */
  stripTotalLengthMm: number;
}

const toUm = (mm: number): number => Math.round(mm * UM_PER_MM);
const toMm = (um: number): number => um / UM_PER_MM;

function checkPiece(piece: Piece): void {
  const ok = (n: number) => Number.isFinite(n) && n > 0;
  if (!ok(piece.widthMm) || !ok(piece.heightMm) || !Number.isInteger(piece.count) || piece.count < 1) {
    throw new RangeError(`Bad piece ${JSON.stringify(piece)}`);
  }
}

function squarePlan(widthUm: number, heightUm: number, cut: StandardCut): CutResult {
  const size = CUT_SIZE_UM[cut];
  const across = Math.floor(widthUm / size);
  const down = Math.floor(heightUm / size);
  const rects: CutRect[] = [];
  for (let row = 0; row < down; row++) {
    for (let col = 0; col < across; col++) {
      rects.push({ x: toMm(col * size), y: toMm(row * size), w: toMm(size), h: toMm(size), cut });
    }
  }
  return { cut, count: rects.length, stripLengthMm: null, utilisation: (rects.length * size * size) / (widthUm * heightUm), rects };
}

/** 2½-in strips along the longer side, stacked across the shorter one. */
function stripPlan(widthUm: number, heightUm: number): CutResult {
  const cut: StandardCut = 'strip_2_5in';
  const size = CUT_SIZE_UM[cut];
  const horizontal = widthUm >= heightUm;
  const lengthUm = horizontal ? widthUm : heightUm;
  const across = horizontal ? heightUm : widthUm;
  const count = lengthUm >= toUm(MIN_STRIP_LENGTH_MM) ? Math.floor(across / size) : 0;
  const rects: CutRect[] = [];
  for (let i = 0; i < count; i++) {
    const offset = toMm(i * size);
    rects.push(
      horizontal
        ? { x: 0, y: offset, w: toMm(lengthUm), h: toMm(size), cut }
        : { x: offset, y: 0, w: toMm(size), h: toMm(lengthUm), cut },
    );
  }
  return {
    cut,
    count,
    stripLengthMm: count > 0 ? toMm(lengthUm) : null,
    utilisation: (count * size * lengthUm) / (widthUm * heightUm),
    rects,
  };
}

function singleCutArea(result: CutResult): number {
  const size = CUT_SIZE_UM[result.cut];
  return result.stripLengthMm === null ? size * size : size * toUm(result.stripLengthMm);
}

/** Every standard cut's plan for one piece, and the suggested one. */
export function planPiece(piece: Piece): PiecePlan {
  checkPiece(piece);
  const widthUm = toUm(piece.widthMm);
  const heightUm = toUm(piece.heightMm);
  const plans: Record<StandardCut, CutResult> = {
    strip_2_5in: stripPlan(widthUm, heightUm),
    square_2_5in: squarePlan(widthUm, heightUm, 'square_2_5in'),
    square_5in: squarePlan(widthUm, heightUm, 'square_5in'),
    square_10in: squarePlan(widthUm, heightUm, 'square_10in'),
  };
  let suggested: CutResult | null = null;
  for (const cut of STANDARD_CUTS) {
    const candidate = plans[cut];
    if (candidate.count === 0) continue;
    const better =
      !suggested ||
      candidate.utilisation > suggested.utilisation ||
      (candidate.utilisation === suggested.utilisation && singleCutArea(candidate) > singleCutArea(suggested));
    if (better) suggested = candidate;
  }
  return { piece, plans, suggested: suggested?.cut ?? null };
}

/** Plans for every listed piece of a bundle, with totals per standard cut. */
export function planBundle(pieces: readonly Piece[]): BundleCutPlan {
  const planned = pieces.map(planPiece);
  const totals: Record<StandardCut, number> = { strip_2_5in: 0, square_2_5in: 0, square_5in: 0, square_10in: 0 };
  let stripTotalLengthMm = 0;
  for (const { piece, plans } of planned) {
    for (const cut of STANDARD_CUTS) totals[cut] += plans[cut].count * piece.count;
    stripTotalLengthMm += plans.strip_2_5in.count * (plans.strip_2_5in.stripLengthMm ?? 0) * piece.count;
  }
  return { pieces: planned, totals, stripTotalLengthMm };
}
