import { randomInt } from 'node:crypto';

const ALPHABET = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';

/** A short reference people can read over the phone or write on a parcel: SR- and six characters without 0/O or 1/I. */
export const newOrderReference = () => `SR-${Array.from({ length: 6 }, () => ALPHABET[randomInt(ALPHABET.length)]).join('')}`;
