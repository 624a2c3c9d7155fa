import { useSyncExternalStore } from 'react';

/**
 * The basket lives in this browser (localStorage), not on the server: nothing is
 * held until checkout. It records whose basket it is, so on a shared tablet the
 * next member starts with an empty one. Shared because the menu shows its count
 * and the checkout feature fills and empties it.
 */

export interface BasketItem {
  bundleId: string;
  quantity: number;
}

export interface Basket {
  memberId: string | null;
  items: readonly BasketItem[];
}

/** The API takes at most 50 of one bundle and 20 bundles per order (orderCreateSchema). */
export const MAX_BASKET_QUANTITY = 50;
export const MAX_BASKET_ITEMS = 60;

export const BASKET_STORAGE_KEY = 'scrap-relay.basket.v1';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const EMPTY: Basket = { memberId: null, items: [] };

export const isBundleId = (value: unknown): value is string => typeof value === 'string' && UUID.test(value);

const clampQuantity = (quantity: number): number => Math.min(MAX_BASKET_QUANTITY, Math.max(1, Math.trunc(quantity)));

/** Reads what is stored, dropping anything malformed (an old version, a hand edit) rather than failing. */
export function parseBasket(raw: string | null): Basket {
  if (!raw) return EMPTY;
  let value: unknown;
  try {
    value = JSON.parse(raw);
  } catch {
    return EMPTY;
  }
  if (typeof value !== 'object' || value === null) return EMPTY;
  const { memberId, items } = value as { memberId?: unknown; items?: unknown };
  const seen = new Set<string>();
  const kept: BasketItem[] = [];
  for (const item of Array.isArray(items) ? items : []) {
    const { bundleId, quantity } = (item ?? {}) as { bundleId?: unknown; quantity?: unknown };
    if (!isBundleId(bundleId) || seen.has(bundleId) || typeof quantity !== 'number' || !Number.isFinite(quantity) || quantity < 1) continue;
    seen.add(bundleId);
    kept.push({ bundleId, quantity: clampQuantity(quantity) });
  }
  return { memberId: typeof memberId === 'string' ? memberId : null, items: kept.slice(0, MAX_BASKET_ITEMS) };
}

/** The items of `memberId`'s basket: someone else's basket on this device counts as empty. */
export const itemsFor = (basket: Basket, memberId: string): readonly BasketItem[] =>
  basket.memberId === memberId ? basket.items : [];

/** Puts a bundle in the basket. Asking twice keeps one line (a reload of the add link must not double it). */
export function withItem(basket: Basket, memberId: string, bundleId: string, quantity = 1): Basket {
  const items = itemsFor(basket, memberId);
  const existing = items.find((item) => item.bundleId === bundleId);
  if (existing) {
    const wanted = Math.max(existing.quantity, clampQuantity(quantity));
    return { memberId, items: items.map((item) => (item.bundleId === bundleId ? { bundleId, quantity: wanted } : item)) };
  }
  return { memberId, items: [...items, { bundleId, quantity: clampQuantity(quantity) }].slice(-MAX_BASKET_ITEMS) };
}

export function withQuantity(basket: Basket, memberId: string, bundleId: string, quantity: number): Basket {
  const items = itemsFor(basket, memberId);
  return { memberId, items: items.map((item) => (item.bundleId === bundleId ? { bundleId, quantity: clampQuantity(quantity) } : item)) };
}

export function withoutItems(basket: Basket, memberId: string, bundleIds: Iterable<string>): Basket {
  const gone = new Set(bundleIds);
  return { memberId, items: itemsFor(basket, memberId).filter((item) => !gone.has(item.bundleId)) };
}

/* ---------- the browser store ---------- */

const listeners = new Set<() => void>();
// Kept when storage is refused (private browsing, storage full), so the basket still works for this visit.
let memoryCopy: string | null = null;
let cached: { raw: string | null; basket: Basket } = { raw: null, basket: EMPTY };

function readRaw(): string | null {
  try {
    return window.localStorage.getItem(BASKET_STORAGE_KEY) ?? memoryCopy;
  } catch {
    return memoryCopy;
  }
}

export function readBasket(): Basket {
  const raw = readRaw();
  if (raw !== cached.raw) cached = { raw, basket: parseBasket(raw) };
  return cached.basket;
}

export function writeBasket(basket: Basket): void {
  const raw = JSON.stringify({ memberId: basket.memberId, items: basket.items });
  memoryCopy = raw;
  try {
    window.localStorage.setItem(BASKET_STORAGE_KEY, raw);
  } catch {
    // The memory copy above carries on for this visit.
  }
  for (const listener of listeners) listener();
}

export const updateBasket = (change: (basket: Basket) => Basket): void => writeBasket(change(readBasket()));

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  // Another tab changed the basket.
  const onStorage = (event: StorageEvent) => {
    if (event.key === BASKET_STORAGE_KEY || event.key === null) listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

const serverSnapshot = () => EMPTY;

/** The stored basket, re-rendering when it changes here or in another tab. */
export const useStoredBasket = (): Basket => useSyncExternalStore(subscribe, readBasket, serverSnapshot);

/** How many bundles (counting copies) are in the basket; for the menu. */
export function useBasketCount(): number {
  const basket = useStoredBasket();
  return basket.items.reduce((sum, item) => sum + item.quantity, 0);
}
