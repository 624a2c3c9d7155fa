import { describe, expect, it } from 'vitest';
import { postalAddressSchema } from '../schemas/orders.ts';
import { allCountries, countryName, isCountryCode } from './countries.ts';

// Country names are Intl.DisplayNames' English names (CLDR data in the browser); codes are ISO 3166-1 alpha-2.
describe('country codes and names', () => {
  it('names real countries and refuses what is not one', () => {
    expect(countryName('US')).toBe('United States');
    expect(countryName('ca')).toBe('Canada');
    // "UN" is what a two-letter box made of "United Nations"… and of "United States"; ZZ is "unknown region".
    expect(isCountryCode('UN')).toBe(false);
    expect(isCountryCode('ZZ')).toBe(false);
    expect(isCountryCode('EU')).toBe(false);
    expect(isCountryCode('USA')).toBe(false);
    expect(isCountryCode('')).toBe(false);
  });

  it('lists every country once, by name, for a guild that posts anywhere', () => {
    const countries = allCountries();
    const codes = countries.map((country) => country.code);
    expect(new Set(codes).size).toBe(codes.length);
    expect(codes).toEqual(expect.arrayContaining(['US', 'CA', 'GB', 'NZ', 'AU', 'IE']));
    expect(codes).not.toEqual(expect.arrayContaining(['UN']));
    const names = countries.map((country) => country.name);
    expect(names).toEqual([...names].sort((a, b) => a.localeCompare(b, 'en')));
  });
});

describe('the country of a postal address, as the API reads it', () => {
  it('takes a country code in either case and refuses two letters that are no country', () => {
    const address = { name: 'A. Quilter', line1: '1 Selvage Row', town: 'Ferncombe', postalCode: '12345' };
    expect(postalAddressSchema.parse({ ...address, country: 'nz' }).country).toBe('NZ');
    for (const country of ['UK', 'EU', 'ZZ', 'QQ']) {
      const result = postalAddressSchema.safeParse({ ...address, country });
      expect(result.success, country).toBe(false);
      expect(result.error?.issues[0]?.path, country).toEqual(['country']);
    }
  });
});
