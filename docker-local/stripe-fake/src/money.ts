/** Amounts stay integer minor units; these helpers only read and print them. */

/**
 * Smallest charge Stripe accepts per currency, in minor units. From memory of
 * Stripe's "minimum and maximum charge amounts" table; currencies not listed
 * get no minimum here.
 */
const MINIMUM_CHARGE: Readonly<Record<string, number>> = {
  usd: 50,
  eur: 50,
  gbp: 30,
  cad: 50,
  aud: 50,
  nzd: 50,
  chf: 50,
  jpy: 50,
  sek: 300,
  nok: 300,
  dkk: 250,
};

/** Stripe caps an amount at eight digits of minor units. */
export const MAX_AMOUNT = 99_999_999;

export function isKnownCurrency(currency: string): boolean {
  if (!/^[a-z]{3}$/.test(currency)) return false;
  try {
    new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() });
    return Intl.supportedValuesOf('currency').includes(currency.toUpperCase());
  } catch {
    return false;
  }
}

export function minimumCharge(currency: string): number {
  return MINIMUM_CHARGE[currency] ?? 0;
}

function formatter(currency: string): Intl.NumberFormat {
  return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() });
}

/** 1250 usd → "$12.50"; 500 jpy → "¥500" (the exponent comes from the currency). */
export function formatMoney(minor: number, currency: string): string {
  const format = formatter(currency);
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(minor / 10 ** digits);
}
