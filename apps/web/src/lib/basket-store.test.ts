import { afterEach, describe, expect, it } from 'vitest';
import {
  BASKET_STORAGE_KEY,
  itemsFor,
  MAX_BASKET_QUANTITY,
  parseBasket,
  readBasket,
  updateBasket,
  withItem,
  withoutItems,
  withQuantity,
  writeBasket,
  type Basket,
} from './basket-store.ts';

const A = '0b7f1c52-6a0e-4c7e-9a51-3f0e8a6d2b11';
const B = '5d2e9f40-1c3b-4a8d-b6e2-7a9c0d4e5f22';
const hester = 'member-hester';
const empty: Basket = { memberId: null, items: [] };

afterEach(() => window.localStorage.clear());

describe('basket contents', () => {
  it('adds a bundle once however often the add link is opened, keeping the larger quantity', () => {
    let basket = withItem(empty, hester, A);
    basket = withItem(basket, hester, A);
    expect(basket.items).toEqual([{ bundleId: A, quantity: 1 }]);
    basket = withItem(basket, hester, A, 3);
    expect(basket.items).toEqual([{ bundleId: A, quantity: 3 }]);
    basket = withItem(basket, hester, A, 2);
    expect(basket.items).toEqual([{ bundleId: A, quantity: 3 }]);
  });

  it('keeps quantities between 1 and the most one order takes', () => {
    let basket = withItem(empty, hester, A, 500);
    expect(basket.items[0]?.quantity).toBe(MAX_BASKET_QUANTITY);
    basket = withQuantity(basket, hester, A, 0);
    expect(basket.items[0]?.quantity).toBe(1);
  });

  it('takes bundles out', () => {
    const basket = withItem(withItem(empty, hester, A), hester, B);
    expect(withoutItems(basket, hester, [A]).items).toEqual([{ bundleId: B, quantity: 1 }]);
  });

  it('treats another member’s basket on a shared device as empty, and replaces it on the first add', () => {
    const theirs = withItem(empty, 'member-orla', A);
    expect(itemsFor(theirs, hester)).toEqual([]);
    expect(withItem(theirs, hester, B)).toEqual({ memberId: hester, items: [{ bundleId: B, quantity: 1 }] });
  });
});

describe('reading what is stored', () => {
  it('drops malformed entries instead of failing', () => {
    const raw = JSON.stringify({
      memberId: hester,
      items: [{ bundleId: A, quantity: 2 }, { bundleId: 'not-an-id', quantity: 1 }, { bundleId: B, quantity: -4 }, { bundleId: A, quantity: 5 }, null],
    });
    expect(parseBasket(raw)).toEqual({ memberId: hester, items: [{ bundleId: A, quantity: 2 }] });
    expect(parseBasket('{not json')).toEqual(empty);
    expect(parseBasket(null)).toEqual(empty);
  });

  it('round-trips through localStorage and returns the same object while nothing changes', () => {
    writeBasket(withItem(empty, hester, A, 2));
    expect(JSON.parse(window.localStorage.getItem(BASKET_STORAGE_KEY) ?? '')).toEqual({ memberId: hester, items: [{ bundleId: A, quantity: 2 }] });
    const first = readBasket();
    expect(readBasket()).toBe(first);
    updateBasket((basket) => withoutItems(basket, hester, [A]));
    expect(readBasket().items).toEqual([]);
  });
});
