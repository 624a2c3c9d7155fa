import { allowsFulfilment, type BundleView } from '@scrap-relay/shared';
import { describe, expect, it } from 'vitest';
import {
  fulfilmentPlans,
  groupBySeller,
  itemsSubtotalMinor,
  preferredFulfilment,
  reviewBasket,
  type BasketLine,
  type BundleLookup,
} from './basket-lines.ts';
import { makeBundleView } from '../../../testing/fixtures.ts';

const me = 'member-hester';

const bundle = (id: string, overrides: Partial<BundleView> = {}): BundleView => makeBundleView({ id, title: `Bundle ${id}`, ...overrides });

const found = (b: BundleView): BundleLookup => ({ status: 'found', bundle: b });
const line = (b: BundleView, quantity = 1): BasketLine => ({ bundleId: b.id, quantity, bundle: b });

describe('checking the basket against the shelf', () => {
  it('keeps what can be ordered, lowers a quantity to what is left, and takes out what is gone, with reasons', () => {
    const items = ['a', 'b', 'c', 'd', 'e', 'f'].map((bundleId) => ({ bundleId, quantity: bundleId === 'b' ? 5 : 1 }));
    const lookups = new Map<string, BundleLookup>([
      ['a', found(bundle('a'))],
      ['b', found(bundle('b', { quantity: 10, quantityAvailable: 3 }))],
      ['c', found(bundle('c', { state: 'rehomed', quantityAvailable: 0 }))],
      ['d', { status: 'gone' }],
      ['e', found(bundle('e', { seller: { id: me, firstName: 'Hester', rehomedCount: 0, returnedCount: 0 } }))],
      ['f', found(bundle('f', { offer: 'starter', priceMinor: null }))],
    ]);
    const review = reviewBasket(items, lookups, me);
    expect(review.lines.map((l) => [l.bundleId, l.quantity])).toEqual([
      ['a', 1],
      ['b', 3],
    ]);
    expect(review.reductions).toEqual([{ bundleId: 'b', title: 'Bundle b', quantity: 3 }]);
    expect(review.removals.map((r) => [r.bundleId, r.reason])).toEqual([
      ['c', 'has found a new home.'],
      ['d', 'is no longer on the shelf.'],
      ['e', 'is your own bundle.'],
      ['f', 'is a starter bundle: new quilters claim those on the starter page.'],
    ]);
  });

  it('keeps a bundle another member is paying for, set aside, since it may come back', () => {
    const held = bundle('h', { state: 'held', quantityAvailable: 0 });
    const review = reviewBasket([{ bundleId: 'h', quantity: 1 }], new Map([['h', found(held)]]), me);
    expect(review.waiting.map((l) => l.bundleId)).toEqual(['h']);
    expect(review.removals).toEqual([]);
  });

  it('changes nothing for bundles still loading or that could not be checked', () => {
    const items = [
      { bundleId: 'p', quantity: 1 },
      { bundleId: 'q', quantity: 2 },
    ];
    const review = reviewBasket(items, new Map<string, BundleLookup>([['q', { status: 'failed' }]]), me);
    expect(review.unchecked).toEqual(items);
    expect(review.removals).toEqual([]);
  });
});

describe('orders per seller and how they travel', () => {
  it('groups by seller in the order bundles were added', () => {
    const ada = { id: 'seller-ada', firstName: 'Ada', rehomedCount: 0, returnedCount: 0 };
    const groups = groupBySeller([line(bundle('1')), line(bundle('2', { seller: ada })), line(bundle('3'))]);
    expect(groups.map((g) => [g.seller.firstName, g.lines.map((l) => l.bundleId)])).toEqual([
      ['Orla', ['1', '3']],
      ['Ada', ['2']],
    ]);
  });

  it('keeps a starter bundle the member may claim, to be posted', () => {
    const claimable = bundle('s', { offer: 'starter', priceMinor: null, abilities: { ...bundle('x').abilities, buy: false, claim: true } });
    const review = reviewBasket([{ bundleId: 's', quantity: 1 }], new Map([['s', found(claimable)]]), me);
    expect(review.lines.map((l) => l.bundleId)).toEqual(['s']);
    expect(allowsFulfilment(claimable, 'post')).toBe(true);
    expect(allowsFulfilment(claimable, 'meeting')).toBe(false);
  });

  it('offers each way with what it would include, preferring post when everything can be posted', () => {
    const sale = line(bundle('s', { meetingHandoverOk: true }));
    const gift = line(bundle('g', { offer: 'postage_only', priceMinor: null }));
    const plans = fulfilmentPlans([sale, gift]);
    expect(plans.map((p) => [p.fulfilment, p.lines.map((l) => l.bundleId), p.leftOut.map((l) => l.bundleId)])).toEqual([
      ['post', ['s', 'g'], []],
      ['meeting', ['s'], ['g']],
    ]);
    expect(preferredFulfilment(plans)).toBe('post');
  });

  it('picks the meeting when only a meeting takes the most bundles', () => {
    const plans = fulfilmentPlans([line(bundle('m1', { offer: 'meeting', priceMinor: null })), line(bundle('m2', { offer: 'meeting', priceMinor: null })), line(bundle('p'))]);
    expect(preferredFulfilment(plans)).toBe('meeting');
    expect(preferredFulfilment([])).toBeNull();
  });

  it('adds up sale prices by quantity; gifts are free', () => {
    expect(itemsSubtotalMinor([line(bundle('a', { priceMinor: 1500 }), 2), line(bundle('g', { offer: 'postage_only', priceMinor: null }))])).toBe(3000);
  });
});
