import {
  formatLength,
  STANDARD_CUT_LABELS,
  STANDARD_CUTS,
  type BundleCutPlan,
  type CutResult,
  type Piece,
  type StandardCut,
  type UnitSystem,
} from '@scrap-relay/shared';
import { longLength } from '../../../utils/yield-text.ts';

/** Side of each standard cut in millimetres (2½ in = 63.5 mm), for the words under the pictures. */
const CUT_SIDE_MM: Readonly<Record<StandardCut, number>> = {
  strip_2_5in: 63.5,
  square_2_5in: 63.5,
  square_5in: 127,
  square_10in: 254,
};

const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

/** "18 × 22 in" (the piece as listed). */
export function pieceSize(piece: Piece, units: UnitSystem): string {
  const [width, height] = [formatLength(piece.widthMm, units), formatLength(piece.heightMm, units)];
  const unit = units === 'metric' ? ' cm' : ' in';
  return `${width.replace(unit, '')} × ${height}`;
}

/** What one plan cuts from one piece: "7 strips of 2½ in × 22 in", "12 squares of 5 in", or "no 10-inch squares". */
export function describeCuts(result: CutResult, units: UnitSystem): string {
  const side = formatLength(CUT_SIDE_MM[result.cut], units);
  if (result.count === 0) return `no ${STANDARD_CUT_LABELS[result.cut]}`;
  if (result.cut === 'strip_2_5in') {
    return `${plural(result.count, 'strip', 'strips')} of ${side} × ${formatLength(result.stripLengthMm ?? 0, units)}`;
  }
  return `${plural(result.count, 'square', 'squares')} of ${side}`;
}

export interface CutTotalLine {
  cut: StandardCut;
  label: string;
  count: number;
  /** Extra detail, e.g. the strips' combined length. */
  detail: string | null;
}

/** One line per standard cut over every piece (each piece's cuts times how many of it there are). */
export function cutTotals(plan: BundleCutPlan, units: UnitSystem): CutTotalLine[] {
  return STANDARD_CUTS.map((cut) => ({
    cut,
    label: STANDARD_CUT_LABELS[cut],
    count: plan.totals[cut],
    detail: cut === 'strip_2_5in' && plan.totals[cut] > 0 ? `${longLength(plan.stripTotalLengthMm, units)} in all` : null,
  }));
}
