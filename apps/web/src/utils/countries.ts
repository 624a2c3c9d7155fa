/**
 * Countries for postal addresses: two-letter codes (ISO 3166-1 alpha-2, what the API stores) named in English
 * by Intl.DisplayNames, so no list of names is kept here.
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

export interface CountryChoice {
  value: string;
  label: string;
}

export interface CountryChoices {
  options: CountryChoice[];
  /** The chosen country, when the guild's postage table lists countries and this is not one of them. */
  uncovered: CountryChoice | null;
  /** The one country the guild posts within, when that is the only choice: shown as text, not a select. */
  only: CountryChoice | null;
}

/**
 * What the country of an address may be: the countries the guild's postage table covers (all countries when
 * it covers any address). An address saved earlier in another real country stays choosable, marked, so
 * opening the form never changes it silently; anything that is not a country is dropped, and the form then
 * starts from the first choice.
 */
export function countryChoices(covered: readonly string[], current: string): CountryChoices {
  const listed = covered
    .map((code) => code.toUpperCase())
    .filter(isCountryCode)
    .map((code) => ({ value: code, label: countryName(code)! }));
  const options = listed.length > 0 ? listed : allCountries().map(({ code, name }) => ({ value: code, label: name }));
  const now = current.trim().toUpperCase();
  let uncovered: CountryChoice | null = null;
  if (isCountryCode(now) && !options.some((option) => option.value === now)) {
    uncovered = { value: now, label: countryName(now)! };
    options.push({ value: now, label: `${uncovered.label} (no postage rates)` });
  }
  return { options, uncovered, only: options.length === 1 ? options[0]! : null };
}

/** The country a form starts from: the one it holds if that is a choice, else `preferred` if that is, else the first choice. */
export function startingCountry(choices: CountryChoices, current: string, preferred = ''): string {
  const isChoice = (code: string) => choices.options.some((option) => option.value === code);
  const now = current.trim().toUpperCase();
  if (isChoice(now)) return now;
  return isChoice(preferred.toUpperCase()) ? preferred.toUpperCase() : (choices.options[0]?.value ?? '');
}
