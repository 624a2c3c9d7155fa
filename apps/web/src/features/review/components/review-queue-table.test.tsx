// @vitest-environment happy-dom
import type { ReviewQueueRow } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { act } from 'react';
import { createMemoryRouter, RouterProvider, useLocation } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { queueReturnSearch } from '../utils/queue-search.ts';
import { ReviewQueueTable } from './review-queue-table.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** 25 bundles: Alder's sale bundles 00–19, then Birch's starter bundles 20–24, one day apart in that order. */
const rows: ReviewQueueRow[] = Array.from({ length: 25 }, (_, i) => {
  const alder = i < 20;
  return {
    id: `b-${i}`,
    title: `Bundle ${String(i).padStart(2, '0')}`,
    offer: alder ? 'sale' : 'starter',
    priceMinor: alder ? 500 : null,
    currency: 'USD',
    weightGrams: 300,
    fibre: 'quilting_cotton',
    thumbUrl: null,
    photoCount: 1,
    seller: alder
      ? { id: 's-alder', firstName: 'Alder', name: 'Alder Quince', rehomedCount: 0, returnedCount: 0 }
      : { id: 's-birch', firstName: 'Birch', name: 'Birch Tamsin', rehomedCount: 0, returnedCount: 0 },
    submittedAt: new Date(Date.UTC(2026, 0, 1 + i)).toISOString(),
    disclosures: { smokeFree: true, petFree: true },
    abilities: { review: true },
  };
});

function serveQueue() {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser({ roles: ['member', 'librarian'] })));
      if (path === '/api/review-queue') return jsonResponse(200, { items: rows });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
}

/** Where the review page's "Back to the queue" would go, from the history state the queue's link left. */
function ReviewPageStandIn() {
  const location = useLocation();
  return <p data-testid="back">{`/review${queueReturnSearch(location.state)}`}</p>;
}

async function renderQueue(entry: string) {
  serveQueue();
  const router = createMemoryRouter(
    [
      { path: '/review', element: <ReviewQueueTable units="imperial" /> },
      { path: '/review/:id', element: <ReviewPageStandIn /> },
    ],
    { initialEntries: [entry] },
  );
  const rendered = await render(
    <QueryClientProvider client={createQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  await waitFor(() => expect(rendered.container.textContent).toContain('Showing'));
  return { router, ...rendered };
}

const titles = (container: HTMLElement) => [...container.querySelectorAll('a[href^="/review/"]')].map((a) => a.textContent);

describe('the review queue keeps its view in the address', () => {
  it('opens on the sort, filters and page the address holds', async () => {
    const { container } = await renderQueue('/review?sort=-title&offer=sale&page=1');
    expect(container.textContent).toContain('Showing 1–20 of 20 bundles');
    expect(titles(container)[0]).toBe('Bundle 19');
    expect(byLabel<HTMLSelectElement>(container, 'Offer').value).toBe('sale');

    const second = await renderQueue('/review?page=2');
    expect(second.container.textContent).toContain('Showing 21–25 of 25 bundles');
    expect(titles(second.container)).toEqual(['Bundle 20', 'Bundle 21', 'Bundle 22', 'Bundle 23', 'Bundle 24']);
  });

  it('writes each change to the address, and a new filter starts again at the first page', async () => {
    const { container, router } = await renderQueue('/review');
    await click(buttonNamed(container, 'Next page →'));
    expect(router.state.location.search).toBe('?page=2');

    await click(buttonNamed(container, /^Bundle/));
    expect(router.state.location.search).toBe('?sort=title');
    expect(titles(container)[0]).toBe('Bundle 00');
    await click(buttonNamed(container, /^Bundle/));
    expect(router.state.location.search).toBe('?sort=-title');
    expect(titles(container)[0]).toBe('Bundle 24');

    const seller = byLabel<HTMLSelectElement>(container, 'Seller');
    await act(async () => {
      seller.value = 's-birch';
      seller.dispatchEvent(new Event('change', { bubbles: true }));
    });
    expect(router.state.location.search).toBe('?sort=-title&seller=s-birch');
    expect(container.textContent).toContain('Showing 1–5 of 5 bundles');

    // Back steps to the view before the filter.
    await act(async () => router.navigate(-1));
    expect(router.state.location.search).toBe('?sort=-title');
    expect(container.textContent).toContain('Showing 1–20 of 25 bundles');
  });

  it('hands its view to the review page, so "Back to the queue" returns to the same page of the same list', async () => {
    const { container } = await renderQueue('/review?offer=starter&sort=-submittedAt');
    await click(container.querySelector('a[href="/review/b-24"]')!);
    await waitFor(() => expect(container.querySelector('[data-testid="back"]')?.textContent).toBe('/review?sort=-submittedAt&offer=starter'));
  });

  it('brings a page past the end back to the last page without a step for Back', async () => {
    const { container, router } = await renderQueue('/review?offer=starter&page=3');
    await waitFor(() => expect(router.state.location.search).toBe('?offer=starter'));
    expect(container.textContent).toContain('Showing 1–5 of 5 bundles');
    expect(router.state.historyAction).toBe('REPLACE');
  });
});

describe('reading the queue’s address', () => {
  it('drops what it does not know and keeps the rest', () => {
    expect(queueReturnSearch({ queueSearch: '?sort=-evil&offer=gold&seller=s-1&page=0&x=1' })).toBe('?seller=s-1');
    expect(queueReturnSearch({ queueSearch: 'javascript:alert(1)' })).toBe('');
    expect(queueReturnSearch(null)).toBe('');
  });
});
