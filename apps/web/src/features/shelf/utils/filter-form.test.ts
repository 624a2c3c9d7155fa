import { describe, expect, it } from 'vitest';
import { filterFormSchema, filterFormValues, type FilterFormContext, type FilterFormValues } from './filter-form.ts';

const blank: FilterFormValues = { offer: '', cut: '', size: '', value: '', family: '', fibre: '', minWeight: '', maxWeight: '', maxPrice: '', q: '' };
const imperial: FilterFormContext = { units: 'imperial', currency: 'USD', current: {} };
const metric: FilterFormContext = { units: 'metric', currency: 'EUR', current: {} };

const parse = (context: FilterFormContext, values: Partial<FilterFormValues>) => filterFormSchema(context).safeParse({ ...blank, ...values });
const messages = (result: ReturnType<typeof parse>) =>
  result.success ? {} : Object.fromEntries(result.error.issues.map((issue) => [issue.path.join('.'), issue.message]));

describe('the shelf filter form', () => {
  it('leaves out everything left at "any"', () => {
    const result = parse(imperial, {});
    expect(result.success && Object.values(result.data).every((v) => v === undefined)).toBe(true);
  });

  it('reads weights in ounces and pounds as whole grams (NIST SP 811: 1 oz = 28.349523125 g, 1 lb = 453.59237 g)', () => {
    const result = parse(imperial, { minWeight: '12', maxWeight: '1 lb 4 oz' });
    // 12 oz = 340.19 g → 340; 1¼ lb = 566.99 g → 567.
    expect(result.success && [result.data.minGrams, result.data.maxGrams]).toEqual([340, 567]);
  });

  it('reads metric weights, a bare number as grams', () => {
    const result = parse(metric, { minWeight: '500', maxWeight: '1.5 kg' });
    expect(result.success && [result.data.minGrams, result.data.maxGrams]).toEqual([500, 1500]);
  });

  it('keeps the exact grams of a weight shown rounded and sent back untouched', () => {
    const context = { ...imperial, current: { minGrams: 500 } };
    const shown = filterFormValues({ minGrams: 500 }, imperial).minWeight;
    expect(shown).toBe('1 lb 2 oz');
    const result = filterFormSchema(context).safeParse({ ...blank, minWeight: shown });
    expect(result.success && result.data.minGrams).toBe(500);
  });

  it('reads the price limit in the currency’s minor units (ISO 4217: USD has 2 decimals)', () => {
    const result = parse(imperial, { maxPrice: '7.5' });
    expect(result.success && result.data.maxPriceMinor).toBe(750);
    expect(filterFormValues({ maxPriceMinor: 750 }, imperial).maxPrice).toBe('7.50');
  });

  it('says what is wrong, on the field concerned', () => {
    expect(messages(parse(imperial, { minWeight: 'heavy' }))).toEqual({ minWeight: 'Enter a weight such as 12 oz.' });
    expect(messages(parse(metric, { minWeight: '2 kg', maxWeight: '1 kg' }))).toEqual({ maxWeight: 'The heaviest weight is less than the lightest.' });
    expect(messages(parse(metric, { maxWeight: '60 kg' }))).toEqual({ maxWeight: 'No bundle weighs more than 50 kg.' });
    expect(messages(parse(imperial, { maxPrice: '7.555' }))).toEqual({ maxPrice: 'Enter an amount such as 10.00.' });
    expect(messages(parse(imperial, { maxPrice: '5000' }))).toEqual({ maxPrice: 'No bundle costs more than $1,000.00.' });
  });

  it('checks menu choices against the vocabularies, as the API does', () => {
    expect(parse(imperial, { fibre: 'spider_silk' }).success).toBe(false);
    expect(parse(imperial, { size: 'strip_7' }).success).toBe(false);
    const result = parse(imperial, { fibre: 'wool', cut: 'fat_quarters', offer: 'sale', q: '  reds  ' });
    expect(result.success && result.data).toMatchObject({ fibre: 'wool', cut: 'fat_quarters', offer: 'sale', q: 'reds' });
    const sized = parse(imperial, { cut: 'strips', size: 'strip_2_5' });
    expect(sized.success && sized.data).toMatchObject({ cut: 'strips', size: 'strip_2_5' });
  });
});
