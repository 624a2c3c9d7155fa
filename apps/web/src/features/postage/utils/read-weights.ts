import type { UnitSystem } from '@scrap-relay/shared';
import { parseTypedWeight } from '../../../utils/weight-text.ts';

export interface TriedWeights {
  grams: number[];
  /** 1-based line numbers that could not be read as a weight. */
  unreadable: number[];
}

/** One weight per line ("1 lb 4 oz", "350 g"); a bare number is in the admin's small unit (ounces or grams). */
export function readWeights(text: string, units: UnitSystem): TriedWeights {
  const result: TriedWeights = { grams: [], unreadable: [] };
  text.split('\n').forEach((line, index) => {
    if (!line.trim()) return;
    const grams = parseTypedWeight(line, units);
    if (grams === null || grams <= 0) result.unreadable.push(index + 1);
    else result.grams.push(grams);
  });
  return result;
}
