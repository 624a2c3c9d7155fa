import { describe, expect, it } from 'vitest';
import { countryChoices, startingCountry } from './countries.ts';

describe('what the country of an address may be', () => {
  it('offers the countries the guild’s postage table covers', () => {
    const choices = countryChoices(['US', 'CA'], 'US');
    expect(choices.uncovered).toBeNull();
    expect(choices.options).toEqual([
      { value: 'US', label: 'United States' },
      { value: 'CA', label: 'Canada' },
    ]);
    expect(choices.only).toBeNull();
  });

  it('is fixed when the guild posts within one country', () => {
    expect(countryChoices(['US'], 'US').only).toEqual({ value: 'US', label: 'United States' });
  });

  it('keeps an address saved earlier in another country choosable, marked, rather than changing it', () => {
    const choices = countryChoices(['US'], 'CA');
    expect(choices.only).toBeNull();
    expect(choices.options.at(-1)).toEqual({ value: 'CA', label: 'Canada (no postage rates)' });
    expect(choices.uncovered).toEqual({ value: 'CA', label: 'Canada' });
    expect(startingCountry(choices, 'CA')).toBe('CA');
  });

  it('drops what is not a country and starts from the first choice', () => {
    const choices = countryChoices(['US', 'CA'], 'UN');
    expect(choices.options.map((option) => option.value)).toEqual(['US', 'CA']);
    expect(startingCountry(choices, 'UN')).toBe('US');
    expect(startingCountry(choices, '')).toBe('US');
    expect(startingCountry(choices, 'ca')).toBe('CA');
  });

  it('offers every country when the table quotes any address, starting from the guild’s likely one', () => {
    const choices = countryChoices([], '');
    expect(choices.options.length).toBeGreaterThan(150);
    expect(startingCountry(choices, '', 'NZ')).toBe('NZ');
  });
});
