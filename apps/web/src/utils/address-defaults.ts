import type { PostalAddress } from '@scrap-relay/shared';

/** The country most members of a guild paying in this currency post within; only a starting value for the form. */
const COUNTRY_BY_CURRENCY: Readonly<Record<string, string>> = { USD: 'US', CAD: 'CA', GBP: 'GB', AUD: 'AU', NZD: 'NZ' };

/**
 * The country an address form starts with: the first the guild's postage table covers (`postageCountries` from
 * the session), or, for a table that quotes any address, the likely one for the guild's currency.
 */
export const defaultCountryFor = (currency: string, postageCountries: readonly string[] = []): string =>
  postageCountries[0]?.toUpperCase() ?? COUNTRY_BY_CURRENCY[currency.toUpperCase()] ?? '';

/** Form values for an address: the saved one, or blanks with the guild's likely country. */
export function addressFormValues(saved: PostalAddress | null, currency: string, postageCountries: readonly string[] = []): PostalAddress {
  return saved ?? { name: '', line1: '', line2: '', town: '', region: '', postalCode: '', country: defaultCountryFor(currency, postageCountries) };
}
