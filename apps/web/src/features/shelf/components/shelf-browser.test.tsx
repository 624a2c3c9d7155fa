// @vitest-environment happy-dom
import type { BundleCard, Page } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { act } from 'react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeBundleCard } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, typeInto, waitFor } from '../../../testing/render.tsx';
import { ShelfBrowser } from './shelf-browser.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const card = makeBundleCard;

/** The shelf API: answers every search with `page`, and records the query strings it was asked. */
function serveShelf(page: Page<BundleCard> & { totalCapped?: boolean }) {
  const asked: URLSearchParams[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const url = new URL(String(input), 'http://app.test');
      if (url.pathname !== '/api/bundles') return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
      asked.push(url.searchParams);
      return jsonResponse(200, page);
    }),
  );
  return asked;
}

async function openShelf(url: string) {
  const router = createMemoryRouter([{ path: '/shelf', element: <ShelfBrowser units="imperial" currency="USD" /> }], { initialEntries: [url] });
  const rendered = await render(
    <QueryClientProvider client={createQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return { router, ...rendered };
}

/** A page of 24 cards, as the API returns while more bundles match. */
const fullPage = () => Array.from({ length: 24 }, (_, i) => card({ id: `b-${i}`, title: `Bundle ${i}` }));

/** Where the pager's link with this text leads, or undefined when there is no such link. */
const pagerHref = (root: HTMLElement, text: string) =>
  [...root.querySelectorAll('a')].find((a) => a.textContent?.includes(text))?.getAttribute('href') ?? undefined;

const statusText = (root: HTMLElement) => [...root.querySelectorAll('[role="status"]')].map((el) => el.textContent).join(' | ');

describe('the shelf', () => {
  it('says "more than" when the API stopped counting at its cap', async () => {
    serveShelf({ items: [card()], page: 1, pageSize: 24, total: 1000, totalCapped: true });
    const { container } = await openShelf('/shelf');

    await waitFor(() => expect(statusText(container)).toContain('Showing 1–1 of more than 1,000 bundles'));
  });

  it('keeps a next page past the count cap while pages come back full', async () => {
    serveShelf({ items: fullPage(), page: 42, pageSize: 24, total: 1000, totalCapped: true });
    const { container } = await openShelf('/shelf?page=42');

    await waitFor(() => expect(statusText(container)).toContain('Showing 985–1,008 of more than 1,000 bundles'));
    expect(container.textContent).toContain('Page 42 of 42 or more');
    expect(pagerHref(container, 'Next page')).toBe('/shelf?page=43');
  });

  it('shows a text search counted four pages ahead as "more than", with the pages known so far', async () => {
    serveShelf({ items: fullPage(), page: 1, pageSize: 24, total: 120, totalCapped: true });
    const { container } = await openShelf('/shelf?q=strips');

    await waitFor(() => expect(statusText(container)).toContain('Showing 1–24 of more than 120 bundles'));
    expect(container.textContent).toContain('Page 1 of 5 or more');
    expect(pagerHref(container, 'Next page')).toBe('/shelf?q=strips&page=2');
  });

  it('counts the page shown among the pages past the cap, and steps back one page from it', async () => {
    serveShelf({ items: fullPage(), page: 50, pageSize: 24, total: 1000, totalCapped: true });
    const { container } = await openShelf('/shelf?page=50');

    await waitFor(() => expect(container.textContent).toContain('Page 50 of 50 or more'));
    expect(pagerHref(container, 'Previous page')).toBe('/shelf?page=49');
    expect(pagerHref(container, 'Next page')).toBe('/shelf?page=51');
  });

  it('does not name a page count for an empty page past the cap, where the count is not known', async () => {
    serveShelf({ items: [], page: 80, pageSize: 24, total: 1000, totalCapped: true });
    const { container } = await openShelf('/shelf?page=80');

    await waitFor(() => expect(statusText(container)).toContain('There is no page 80; this search has fewer pages.'));
    expect(container.textContent).not.toContain('42 pages');
    expect(pagerHref(container, 'Next page')).toBeUndefined();
  });

  it('asks the API for what the address says and shows each bundle as a card', async () => {
    const asked = serveShelf({ items: [card()], page: 2, pageSize: 24, total: 25 });
    const { container } = await openShelf('/shelf?fibre=batik&page=2');

    await waitFor(() => expect(statusText(container)).toContain('Showing 25–25 of 25 bundles'));
    expect(Object.fromEntries(asked[0]!)).toEqual({ fibre: 'batik', sort: 'newest', page: '2', pageSize: '24' });

    const link = [...container.querySelectorAll('a')].find((a) => a.textContent === 'Indigo batik strips');
    expect(link?.getAttribute('href')).toBe('/bundles/b-1');
    const item = link!.closest('li')!;
    expect(item.textContent).toContain('$12.00');
    // 454 g is 1 lb to the nearest ounce (NIST SP 811).
    expect(item.textContent).toContain('1 lb · Batik');
    expect(item.textContent).toMatch(/≈ \d+ five-inch squares · \d+ strips/);
    const photo = item.querySelector('img')!;
    expect(photo.getAttribute('alt')).toBe('Photo: Indigo batik strips');
    expect(photo.getAttribute('srcset')).toBe('/uploads/photos/b-1-400.webp 400w, /uploads/photos/b-1-800.webp 800w');
    expect(photo.getAttribute('sizes')).toMatch(/calc\(100vw - 40px\)$/);

    expect(container.textContent).toContain('Page 2 of 2');
    expect(pagerHref(container, 'Previous page')).toBe('/shelf?fibre=batik');
  });

  it('loads the first row of photos at once, the first one first, and the rest when scrolled near', async () => {
    const titles = ['Indigo batik strips', 'Red flannel squares', 'Linen offcuts', 'Selvage bundle', 'Improv pieces'];
    serveShelf({ items: titles.map((title, i) => card({ id: `b-${i}`, title })), page: 1, pageSize: 24, total: 5 });
    const { container } = await openShelf('/shelf');

    await waitFor(() => expect(container.querySelectorAll('li img')).toHaveLength(5));
    const photos = [...container.querySelectorAll('li img')];
    expect(photos.map((img) => img.getAttribute('loading'))).toEqual(['eager', 'eager', 'eager', 'lazy', 'lazy']);
    expect(photos.map((img) => img.getAttribute('fetchpriority'))).toEqual(['high', null, null, null, null]);
    for (const img of photos) expect([img.getAttribute('width'), img.getAttribute('height')]).toEqual(['400', '300']);
  });

  it('offers only the thumbnail of a photo stored before the medium size existed', async () => {
    serveShelf({ items: [card({ thumb2xUrl: null })], page: 1, pageSize: 24, total: 1 });
    const { container } = await openShelf('/shelf');

    await waitFor(() => expect(container.querySelector('li img')).not.toBeNull());
    const photo = container.querySelector('li img')!;
    expect(photo.getAttribute('src')).toBe('/uploads/photos/b-1-400.webp');
    expect(photo.hasAttribute('srcset')).toBe(false);
    expect(photo.hasAttribute('sizes')).toBe(false);
  });

  it('puts applied filters in the address, weights in grams, and starts again at page 1', async () => {
    const asked = serveShelf({ items: [card()], page: 1, pageSize: 24, total: 1 });
    const { container, router } = await openShelf('/shelf?page=3&sort=price_asc');
    await waitFor(() => expect(asked.length).toBe(1));
    // The filter form loads after the bundles.
    await waitFor(() => byLabel(container, 'Words in the title or description'));

    await typeInto(byLabel(container, 'Words in the title or description'), 'indigo');
    await typeInto(byLabel(container, 'At least'), '8 oz');
    const fibre = byLabel<HTMLSelectElement>(container, 'Fibre');
    await act(async () => {
      fibre.value = 'batik';
      fibre.dispatchEvent(new Event('change', { bubbles: true }));
    });
    await click(buttonNamed(container, 'Show bundles'));

    // 8 oz = 226.796185 g → 227 (NIST SP 811).
    await waitFor(() => expect(router.state.location.search).toBe('?fibre=batik&minGrams=227&q=indigo&sort=price_asc'));
    await waitFor(() => expect(Object.fromEntries(asked.at(-1)!)).toEqual({ fibre: 'batik', minGrams: '227', q: 'indigo', sort: 'price_asc', page: '1', pageSize: '24' }));
  });

  it('refuses a weight it cannot read, on the field, and leaves the search alone', async () => {
    serveShelf({ items: [], page: 1, pageSize: 24, total: 0 });
    const { container, router } = await openShelf('/shelf?cut=selvages');
    await waitFor(() => expect(statusText(container)).toContain('No bundle matches these filters.'));
    await waitFor(() => byLabel(container, 'At most'));

    await typeInto(byLabel(container, 'At most'), 'a big bag');
    await click(buttonNamed(container, 'Show bundles'));

    await waitFor(() => expect(byLabel(container, 'At most').getAttribute('aria-invalid')).toBe('true'));
    expect(container.textContent).toContain('Enter a weight such as 12 oz.');
    expect(router.state.location.search).toBe('?cut=selvages');
  });

  it('says so when the shelf is empty', async () => {
    serveShelf({ items: [], page: 1, pageSize: 24, total: 0 });
    const { container } = await openShelf('/shelf');
    await waitFor(() => expect(statusText(container)).toContain('The shelf is empty just now.'));
    expect(container.textContent).toContain('once the librarian has checked and approved them');
  });
});
