// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse } from '../testing/fixtures.ts';
import { getBasket, LEGACY_BASKET_KEY, MAX_BASKET_QUANTITY, parseLegacyBasket } from './basket-store.ts';

const A = '0b7f1c52-6a0e-4c7e-9a51-3f0e8a6d2b11';
const B = '5d2e9f40-1c3b-4a8d-b6e2-7a9c0d4e5f22';
const C = '9e8d7c6b-5a4f-4e3d-8c2b-1a0f9e8d7c6b';
const hester = 'member-hester';

afterEach(() => {
  window.localStorage.clear();
  vi.unstubAllGlobals();
});

describe('a basket an earlier version kept in this browser', () => {
  it('is read for its own member only, dropping malformed entries instead of failing', () => {
    const raw = JSON.stringify({
      memberId: hester,
      items: [{ bundleId: A, quantity: 2 }, { bundleId: 'not-an-id', quantity: 1 }, { bundleId: B, quantity: -4 }, { bundleId: A, quantity: 5 }, null, { bundleId: C, quantity: 900 }],
    });
    expect(parseLegacyBasket(raw, hester)).toEqual([
      { bundleId: A, quantity: 2 },
      { bundleId: C, quantity: MAX_BASKET_QUANTITY },
    ]);
    // Another member's basket on a shared device is not this member's.
    expect(parseLegacyBasket(raw, 'member-orla')).toEqual([]);
    expect(parseLegacyBasket('{not json', hester)).toEqual([]);
    expect(parseLegacyBasket(null, hester)).toEqual([]);
  });

  it('moves to the server once: what the server refuses is left out, what it could not answer waits for the next visit', async () => {
    window.localStorage.setItem(
      LEGACY_BASKET_KEY,
      JSON.stringify({ memberId: hester, items: [{ bundleId: A, quantity: 2 }, { bundleId: B, quantity: 1 }, { bundleId: C, quantity: 1 }] }),
    );
    const posted: unknown[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
        const path = new URL(String(input), 'http://app.test').pathname;
        if (path === '/api/session') return jsonResponse(200, { user: null, guild: null, csrfToken: 'token-a' });
        if (path === '/api/basket/items' && init?.method === 'POST') {
          const body = JSON.parse(String(init.body)) as { bundleId: string };
          posted.push(body);
          if (body.bundleId === B) return jsonResponse(409, { error: { code: 'conflict', message: 'That bundle is no longer on the shelf.', fields: { bundleId: 'Not on the shelf.' } } });
          if (body.bundleId === C) return jsonResponse(503, { error: { code: 'service_unavailable', message: 'Try again soon.' } });
          return jsonResponse(200, { basket: { items: [] } });
        }
        if (path === '/api/basket') return jsonResponse(200, { basket: { items: [{ bundleId: A, quantity: 2, addedAt: '2026-12-02T10:00:00.000Z' }] } });
        return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
      }),
    );

    const basket = await getBasket(hester);
    expect(basket.items).toEqual([{ bundleId: A, quantity: 2, addedAt: '2026-12-02T10:00:00.000Z' }]);
    expect(posted).toEqual([
      { bundleId: A, quantity: 2 },
      { bundleId: B, quantity: 1 },
      { bundleId: C, quantity: 1 },
    ]);
    expect(JSON.parse(window.localStorage.getItem(LEGACY_BASKET_KEY) ?? '{}')).toEqual({ memberId: hester, items: [{ bundleId: C, quantity: 1 }] });

    // The next visit asks about the one left, and then nothing is left in the browser.
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL) => {
        const path = new URL(String(input), 'http://app.test').pathname;
        if (path === '/api/session') return jsonResponse(200, { user: null, guild: null, csrfToken: 'token-a' });
        return jsonResponse(200, { basket: { items: [] } });
      }),
    );
    await getBasket(hester);
    expect(window.localStorage.getItem(LEGACY_BASKET_KEY)).toBeNull();
  });
});
