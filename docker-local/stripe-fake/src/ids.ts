import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Random base-62 text; 24 characters carry about 143 bits, plenty for local ids. */
export function randomToken(length = 24): string {
  const bytes = randomBytes(length * 2);
  let out = '';
  for (const byte of bytes) {
    // 248 = 4 × 62: dropping larger bytes keeps every character equally likely.
    if (byte >= 248) continue;
    out += ALPHABET[byte % 62];
    if (out.length === length) return out;
  }
  return out + randomToken(length - out.length);
}

/** Stripe-style id such as `cs_test_a1B2…`; the prefix tells the object kind. */
export function newId(prefix: string): string {
  return `${prefix}_${randomToken()}`;
}
