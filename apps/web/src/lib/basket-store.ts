import { MAX_LINE_QUANTITY, type BasketAddInput, type BasketView } from '@scrap-relay/shared';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';
import { api, isApiError } from './api-client.ts';

/**
 * The member's basket lives on the server (`/api/basket`), so it follows them from the phone at a meeting to the
 * computer at home; nothing is held for them until checkout. Shared because the menu shows its count and the
 * checkout feature fills and empties it. Every change answers with the whole basket, which replaces the cached one.
 */

export interface BasketItem {
  bundleId: string;
  quantity: number;
}

/** The most copies of one bundle a basket line (and an order) asks for. */
export const MAX_BASKET_QUANTITY = MAX_LINE_QUANTITY;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export const isBundleId = (value: unknown): value is string => typeof value === 'string' && UUID.test(value);

/** Per member, so a shared device never shows one member another's basket from the cache. */
export const basketQueryKey = (memberId: string) => ['basket', memberId] as const;

/* ---------- the basket an earlier version kept in this browser ---------- */

/** Where an earlier version kept the basket, in this browser only. */
export const LEGACY_BASKET_KEY = 'scrap-relay.basket.v1';

/**
 * Reads a basket an earlier version left in this browser, dropping anything malformed (a hand edit, another
 * member's basket on a shared device) rather than failing.
 */
export function parseLegacyBasket(raw: string | null, memberId: string): BasketItem[] {
  if (!raw) return [];
  let value: unknown;
  try {
    value = JSON.parse(raw);
  } catch {
    return [];
  }
  if (typeof value !== 'object' || value === null) return [];
  const { memberId: owner, items } = value as { memberId?: unknown; items?: unknown };
  if (owner !== memberId || !Array.isArray(items)) return [];
  const seen = new Set<string>();
  const kept: BasketItem[] = [];
  for (const item of items) {
    const { bundleId, quantity } = (item ?? {}) as { bundleId?: unknown; quantity?: unknown };
    if (!isBundleId(bundleId) || seen.has(bundleId) || typeof quantity !== 'number' || !Number.isFinite(quantity) || quantity < 1) continue;
    seen.add(bundleId);
    kept.push({ bundleId, quantity: Math.min(MAX_BASKET_QUANTITY, Math.trunc(quantity)) });
  }
  return kept;
}

/**
 * Moves a basket an earlier version kept in this browser to the server, once: each bundle is added (a bundle
 * already there keeps the larger quantity), one that can no longer be added is left out, and the browser's copy
 * is removed once every line has had its answer. A line the server could not be asked about stays for next time.
 */
async function moveLegacyBasket(memberId: string): Promise<void> {
  let raw: string | null;
  try {
    raw = window.localStorage.getItem(LEGACY_BASKET_KEY);
  } catch {
    return;
  }
  const items = parseLegacyBasket(raw, memberId);
  const unanswered: BasketItem[] = [];
  for (const item of items) {
    try {
      await api.post('/basket/items', item);
    } catch (error) {
      // A 4xx is the server's answer (gone from the shelf, the member's own); anything else is asked again next time.
      if (!isApiError(error) || error.status >= 500) unanswered.push(item);
    }
  }
  try {
    if (unanswered.length === 0) window.localStorage.removeItem(LEGACY_BASKET_KEY);
    else window.localStorage.setItem(LEGACY_BASKET_KEY, JSON.stringify({ memberId, items: unanswered }));
  } catch {
    // Storage refused: the next visit tries again, and adding twice adds nothing.
  }
}

/* ---------- the server's basket ---------- */

export const getBasket = async (memberId: string, { signal }: { signal?: AbortSignal } = {}): Promise<BasketView> => {
  await moveLegacyBasket(memberId);
  return (await api.get<{ basket: BasketView }>('/basket', { signal })).basket;
};

/** The member's basket; `enabled: false` waits (the menu asks only once the page has loaded). */
export const useBasket = (memberId: string, { enabled = true }: { enabled?: boolean } = {}) =>
  useQuery({ queryKey: basketQueryKey(memberId), queryFn: ({ signal }) => getBasket(memberId, { signal }), enabled });

/** Every change to the basket runs after the one before it, so answers arrive in the order the changes were made. */
const BASKET_CHANGES = { id: 'basket' } as const;

/**
 * Changes to the basket. Quantity changes and removals show at once and are put back if the server refuses;
 * every answer replaces the cached basket with the server's. Changes run one at a time (`scope`), and a read of the
 * basket still on its way is cancelled first, so an older answer never lands after a newer one.
 */
export function useBasketChanges(memberId: string) {
  const queryClient = useQueryClient();
  const key = basketQueryKey(memberId);
  const settle = (basket: BasketView) => queryClient.setQueryData(key, basket);
  const optimistic = (change: (items: BasketView['items']) => BasketView['items']) => async () => {
    await queryClient.cancelQueries({ queryKey: key });
    const before = queryClient.getQueryData<BasketView>(key);
    if (before) queryClient.setQueryData<BasketView>(key, { items: change(before.items) });
    return { before };
  };
  const putBack = (_error: unknown, _input: unknown, context: { before?: BasketView } | undefined) => {
    if (context?.before) queryClient.setQueryData(key, context.before);
    void queryClient.invalidateQueries({ queryKey: key });
  };

  const add = useMutation({
    scope: BASKET_CHANGES,
    mutationFn: async (input: BasketAddInput) => (await api.post<{ basket: BasketView }>('/basket/items', input)).basket,
    onMutate: () => queryClient.cancelQueries({ queryKey: key }),
    onSuccess: settle,
  });
  const setQuantity = useMutation({
    scope: BASKET_CHANGES,
    mutationFn: async ({ bundleId, quantity }: { bundleId: string; quantity: number }) =>
      (await api.patch<{ basket: BasketView }>(`/basket/items/${bundleId}`, { quantity })).basket,
    onMutate: ({ bundleId, quantity }) => optimistic((items) => items.map((i) => (i.bundleId === bundleId ? { ...i, quantity } : i)))(),
    onSuccess: settle,
    onError: putBack,
  });
  const remove = useMutation({
    scope: BASKET_CHANGES,
    mutationFn: async (bundleId: string) => (await api.delete<{ basket: BasketView }>(`/basket/items/${bundleId}`)).basket,
    onMutate: (bundleId) => optimistic((items) => items.filter((i) => i.bundleId !== bundleId))(),
    onSuccess: settle,
    onError: putBack,
  });
  return { add, setQuantity, remove };
}

/* ---------- the menu's count ---------- */

function subscribeToLoad(listener: () => void): () => void {
  window.addEventListener('load', listener);
  return () => window.removeEventListener('load', listener);
}
const pageLoaded = () => document.readyState === 'complete';

/**
 * How many bundles (counting copies) are in the basket; for the menu. It asks the server only once the page has
 * loaded, so the count never competes with the page's own first requests on a slow connection.
 */
export function useBasketCount(memberId: string | null): number {
  const loaded = useSyncExternalStore(subscribeToLoad, pageLoaded, () => false);
  const basket = useBasket(memberId ?? '', { enabled: loaded && memberId !== null }).data;
  return basket ? basket.items.reduce((sum, item) => sum + item.quantity, 0) : 0;
}
