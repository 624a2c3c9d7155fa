import { allCountries, countryName, isCountryCode } from '@scrap-relay/shared';

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
