// @vitest-environment happy-dom
import type { BundleView, MeetingView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeBundleView, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { makePostageQuote } from '../../../testing/postage.ts';
import { buttonNamed, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { BasketView } from './basket-view.tsx';

const member = makeUser();
const BUNDLE_ID = '0b7f1c52-6a0e-4c7e-9a51-3f0e8a6d2b11';
const MEETING_ID = '7c1d2e3f-4a5b-4c6d-8e7f-9a0b1c2d3e4f';

const bundle = (overrides: Partial<BundleView> = {}): BundleView =>
  makeBundleView({
    id: BUNDLE_ID,
    title: 'Dark batik 2½-inch strips',
    priceMinor: 1200,
    currency: 'GBP',
    weightGrams: 454,
    fibre: 'batik',
    colour: { value: 'dark', family: 'cool', suggested: null },
    seller: { id: 'seller-orla', firstName: 'Orla', rehomedCount: 2, returnedCount: 0 },
    ...overrides,
  });

const quote = makePostageQuote({
  explanation: ['Postal code “LH1 4QT” is in zone local (prefix “LH1”).', 'Total postage: £7.30.'],
  currency: 'GBP',
});

const meeting: MeetingView = { id: MEETING_ID, startsAt: '2026-12-10T19:00:00.000Z', place: 'Larkhollow Chapel Hall', notes: '', abilities: { edit: false } };
const savedAddress = { name: 'Hester Quill', line1: '3 Loom Street', line2: '', town: 'Larkhollow', region: '', postalCode: 'LH1 4QT', country: 'GB' };

interface ApiScript {
  /** `null`: the bundle is gone (404). */
  bundleAnswers: Array<BundleView | null>;
  orderAnswer: Response;
  /** How the server answers taking a bundle out of the basket; it takes it out when left unset. */
  deleteAnswer?: () => Response;
}

/**
 * The API as the basket sees it; each GET of the bundle takes the next answer (the last one repeats). The basket
 * starts with one copy of the bundle; `basket` is what the server holds as the page changes it, and placing an
 * order takes its bundles out, as the API does.
 */
function serveApi(script: ApiScript) {
  const orders: unknown[] = [];
  let basket = [{ bundleId: BUNDLE_ID, quantity: 1, addedAt: '2026-12-01T09:00:00.000Z' }];
  const calls = { basketReads: 0, deletes: 0 };
  const server = { orders, basket: () => basket, calls };
  let bundleCalls = 0;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(member));
      if (path === `/api/bundles/${BUNDLE_ID}`) {
        const answer = script.bundleAnswers[Math.min(bundleCalls++, script.bundleAnswers.length - 1)];
        return answer ? jsonResponse(200, { bundle: answer }) : jsonResponse(404, { error: { code: 'not_found', message: 'That bundle was not found.' } });
      }
      if (path === '/api/me/address') return jsonResponse(200, { address: savedAddress });
      if (path === '/api/meetings') return jsonResponse(200, { items: [meeting] });
      if (path === '/api/postage-quotes') return jsonResponse(200, quote);
      if (path === '/api/basket') {
        calls.basketReads += 1;
        return jsonResponse(200, { basket: { items: basket } });
      }
      if (path === `/api/basket/items/${BUNDLE_ID}` && init?.method === 'DELETE') {
        calls.deletes += 1;
        if (script.deleteAnswer) return script.deleteAnswer();
        basket = basket.filter((item) => item.bundleId !== BUNDLE_ID);
        return jsonResponse(200, { basket: { items: basket } });
      }
      if (path === '/api/orders' && init?.method === 'POST') {
        const order = JSON.parse(String(init.body)) as { items: { bundleId: string }[] };
        orders.push(order);
        if (script.orderAnswer.status === 201) basket = basket.filter((item) => !order.items.some((ordered) => ordered.bundleId === item.bundleId));
        return script.orderAnswer;
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return server;
}

async function openBasket() {
  const router = createMemoryRouter(
    [
      { path: '/basket', element: <BasketView member={{ id: member.id, units: 'metric', emailVerified: true }} guild={{ name: 'Larkhollow Quilting Circle', currency: 'GBP' }} /> },
      { path: '/orders/:id', element: <p>The order page</p> },
    ],
    { initialEntries: ['/basket'] },
  );
  const rendered = await render(
    <QueryClientProvider client={createQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { router, ...rendered };
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('checking out the basket', () => {
  it('quotes the postage to the saved address, and keeps the basket when the payment service is down', async () => {
    const server = serveApi({ bundleAnswers: [bundle()], orderAnswer: jsonResponse(503, { error: { code: 'service_unavailable', message: 'The card payment service is not answering just now.' } }) });
    const { container } = await openBasket();

    const pay = await waitFor(() => buttonNamed(container, 'Pay £19.30 by card'), 3000);
    expect(container.textContent).toContain('Padded mailer');
    const notes = container.querySelector('aside[aria-label="Before you pay"]');
    expect(notes?.textContent).toContain('Larkhollow Quilting Circle is the merchant.');
    expect(notes?.textContent).toContain('Your postal address goes only to the seller of a paid order');
    await click(pay);

    await waitFor(() => expect(container.querySelector('[role="alert"]')?.textContent).toContain('The card payment service is not answering just now.'));
    expect(container.textContent).toContain('Nothing was taken from your card and nothing is held.');
    expect(server.orders).toEqual([{ items: [{ bundleId: BUNDLE_ID, quantity: 1 }], fulfilment: 'post', address: savedAddress, saveAddress: false }]);
    // Nothing was held, so the bundle stays in the basket to try again.
    expect(server.basket()).toHaveLength(1);
  });

  it('takes out a bundle someone else bought first, says why, charges nothing, and points the empty basket to the shelf', async () => {
    const server = serveApi({
      bundleAnswers: [bundle(), bundle({ state: 'rehomed', quantityAvailable: 0 })],
      orderAnswer: jsonResponse(409, { error: { code: 'conflict', message: '“Dark batik 2½-inch strips” is no longer available.', fields: { items: 'No longer available.' } } }),
    });
    const { container } = await openBasket();

    await click(await waitFor(() => buttonNamed(container, 'Pay £19.30 by card'), 3000));

    await waitFor(() => expect(container.textContent).toContain('“Dark batik 2½-inch strips” has found a new home. It has been taken out of your basket.'));
    expect(container.textContent).toContain('Your basket is empty.');
    const shelfLink = [...container.querySelectorAll('a')].find((a) => a.textContent === 'Browse the shelf');
    expect(shelfLink?.getAttribute('href')).toBe('/shelf');
    // Taken out on the server too, so every device shows it gone.
    expect(server.basket()).toEqual([]);
  });

  it('confirms a free meeting handover at once and opens the order, with nothing to pay', async () => {
    const server = serveApi({
      bundleAnswers: [bundle({ offer: 'meeting', priceMinor: null })],
      orderAnswer: jsonResponse(201, { order: { id: 'order-77', reference: 'SR-7QK2' }, checkoutUrl: null }),
    });
    const { container, router } = await openBasket();

    const confirm = await waitFor(() => buttonNamed(container, 'Confirm: I will collect it at the meeting'));
    expect(container.textContent).toContain('Larkhollow Chapel Hall');
    // Nothing is paid and nothing posted: no notes about card payments, holds or addresses.
    expect(container.querySelector('aside[aria-label="Before you pay"]')).toBeNull();
    const readsBefore = server.calls.basketReads;
    await click(confirm);

    await waitFor(() => expect(router.state.location.pathname).toBe('/orders/order-77'));
    expect(server.orders).toEqual([{ items: [{ bundleId: BUNDLE_ID, quantity: 1 }], fulfilment: 'meeting', meetingId: MEETING_ID }]);
    // The order took its bundle out of the basket on the server; the app reads the basket again rather than guess.
    await waitFor(() => expect(server.calls.basketReads).toBeGreaterThan(readsBefore));
  });
});

describe('tidying the basket', () => {
  it('asks once to take out a bundle that is gone, and does not ask again when the server refuses', async () => {
    const server = serveApi({
      bundleAnswers: [null],
      orderAnswer: jsonResponse(500, {}),
      deleteAnswer: () => jsonResponse(503, { error: { code: 'service_unavailable', message: 'Try again soon.' } }),
    });
    const { container } = await openBasket();

    await waitFor(() => expect(container.textContent).toContain('A bundle is no longer on the shelf. It has been taken out of your basket.'));
    await waitFor(() => expect(container.textContent).toContain('Your basket could not be changed'));
    // Give a loop every chance to show itself before counting.
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(server.calls.deletes).toBe(1);
    expect(server.calls.basketReads).toBeLessThan(5);
  });
});
