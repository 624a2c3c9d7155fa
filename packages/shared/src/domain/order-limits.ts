/**
 * How much one order and one basket hold. Kept apart from the zod schemas that enforce them, so the web app's
 * menu (which shows the basket) can read them without loading zod on every page.
 */

/** Copies of one bundle an order, or a basket line, asks for at most. */
export const MAX_LINE_QUANTITY = 50;

/** Lines a member's basket holds at most (an order takes up to 20, so a basket can feed three). */
export const MAX_BASKET_LINES = 60;
