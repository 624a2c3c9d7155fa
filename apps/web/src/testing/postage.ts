import type { PostageQuoteView } from '@scrap-relay/shared';

/**
 * A quote for one 454 g bundle in a padded mailer to the local zone, by the guild's default table:
 * 454 g + 25 g tare = 479 g → the 2 lb local band, 680, plus 50 handling.
 */
export function makePostageQuote(overrides: Partial<PostageQuoteView> = {}): PostageQuoteView {
  return {
    zone: 'local',
    parcels: [
      {
        number: 1,
        units: [{ ref: 'Dark batik 2½-inch strips', grams: 454 }],
        packageCode: 'padded_mailer',
        packageName: 'Padded mailer',
        contentGrams: 454,
        tareGrams: 25,
        dimensionalGrams: null,
        billableGrams: 479,
        zone: 'local',
        bandMaxGrams: 907,
        priceMinor: 680,
      },
    ],
    handlingMinor: 50,
    totalMinor: 730,
    explanation: ['Postal code “97451” is in zone local (prefix “9745”).', 'Total postage: $7.30.'],
    currency: 'USD',
    ...overrides,
  };
}
