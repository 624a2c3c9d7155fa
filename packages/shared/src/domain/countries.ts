/**
 * Countries for postal addresses: two-letter codes (ISO 3166-1 alpha-2, what the API stores) named in English
 * by Intl.DisplayNames, so no list of names is kept here. The API refuses a code this does not name (the address
 * schemas), and the web app offers only codes it names.
 */

const regionNames = new Intl.DisplayNames(['en'], { type: 'region', fallback: 'none' });

/**
 * Two-letter codes Intl names that are not countries to post to: ISO 3166-1's exceptionally reserved codes
 * (EU, EZ, UK, UN and the like), transitionally reserved codes of countries that no longer exist or were renamed
 * (DD, SU, YU, ZR …), and the private-use codes CLDR gives names (QO, XA, XB, ZZ). Listed from memory of the
 * ISO 3166 Maintenance Agency's reserved-code table; a country Intl names but this list misses only adds a row
 * to the choice.
 */
const NOT_COUNTRIES = new Set([
  'AN', 'BU', 'CP', 'CS', 'DD', 'DG', 'DY', 'EA', 'EU', 'EZ', 'FX', 'HV', 'IC', 'NH', 'QO', 'RH', 'SU', 'TA', 'TP', 'UK', 'UN', 'VD',
  'XA', 'XB', 'YD', 'YU', 'ZR', 'ZZ',
]);

const TWO_LETTERS = /^[A-Z]{2}$/;

/** The English name of a country code ("US" → "United States"), or undefined when it is not a country. */
export function countryName(code: string): string | undefined {
  const upper = code.trim().toUpperCase();
  if (!TWO_LETTERS.test(upper) || NOT_COUNTRIES.has(upper)) return undefined;
  return regionNames.of(upper);
}

export const isCountryCode = (code: string): boolean => countryName(code) !== undefined;

let everyCountry: Array<{ code: string; name: string }> | undefined;

/** Every country Intl names, by name. For a guild whose postage table quotes any address. */
export function allCountries(): ReadonlyArray<{ code: string; name: string }> {
  if (!everyCountry) {
    const found: Array<{ code: string; name: string }> = [];
    for (let first = 65; first <= 90; first++) {
      for (let second = 65; second <= 90; second++) {
        const code = String.fromCharCode(first, second);
        const name = countryName(code);
        if (name) found.push({ code, name });
      }
    }
    everyCountry = found.sort((a, b) => a.name.localeCompare(b.name, 'en'));
  }
  return everyCountry;
}
