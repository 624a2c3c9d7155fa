import { parseWeightToGrams, type UnitSystem } from '@scrap-relay/shared';

/**
 * Weights as members type them, read the same way everywhere (listing form, shelf
 * filter, postage tester): a number alone is in the member's smaller everyday unit,
 * ounces or grams.
 */
const bareWeightUnit = (units: UnitSystem): 'oz' | 'g' => (units === 'metric' ? 'g' : 'oz');

/** The hint sentence that says so. */
export const bareWeightNote = (units: UnitSystem): string => `A number alone counts as ${units === 'metric' ? 'grams' : 'ounces'}.`;

/** "1 lb 4 oz", "750 g", "12" (ounces or grams) → whole grams; null when it does not read as a weight. */
export const parseTypedWeight = (text: string, units: UnitSystem): number | null => parseWeightToGrams(text, { bareUnit: bareWeightUnit(units) });
