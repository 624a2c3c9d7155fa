// @vitest-environment happy-dom
import type { WishView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { SaveWishPanel } from './save-wish-panel.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/**
 * The wishes API: `saved` are the member's wishes; POST keeps what it is sent, or, given `savedElsewhere` (a wish
 * saved in another tab that this page's list does not have yet), refuses it as that wish's twin.
 */
function serveWishes(saved: WishView[] = [], savedElsewhere?: WishView) {
  const posted: unknown[] = [];
  const wishes = [...saved];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser()));
      if (path === '/api/wishes' && init?.method === 'POST') {
        const body = JSON.parse(String(init.body)) as { name: string; filters: Record<string, string | number> };
        posted.push(body);
        if (savedElsewhere) {
          wishes.push(savedElsewhere);
          const message = `You already have a wish for these filters (Dark, Batik): “${savedElsewhere.name}”.`;
          return jsonResponse(409, { error: { code: 'conflict', message, fields: { filters: `Already saved as your wish “${savedElsewhere.name}”.` } } });
        }
        const wish = { id: `w-${wishes.length + 1}`, ...body, createdAt: '2026-03-01T10:00:00.000Z' };
        wishes.push(wish);
        return jsonResponse(201, { wish });
      }
      if (path === '/api/wishes') return jsonResponse(200, { items: wishes });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return posted;
}

const darkBatik: WishView = { id: 'w-9', name: 'Dark batik', filters: { value: 'dark', fibre: 'batik' }, createdAt: '2026-02-01T10:00:00.000Z' };

async function renderPanel(filters: Parameters<typeof SaveWishPanel>[0]['filters']) {
  const router = createMemoryRouter([{ path: '/shelf', element: <SaveWishPanel filters={filters} units="imperial" currency="USD" /> }], {
    initialEntries: ['/shelf'],
  });
  return render(
    <QueryClientProvider client={createQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
}

describe('saving the shelf’s filters as a wish', () => {
  it('suggests the filters in words as the name and sends the filters as they are', async () => {
    const posted = serveWishes();
    const { container } = await renderPanel({ fibre: 'batik', value: 'dark', cut: 'strips', minGrams: 227 });

    await click(buttonNamed(container, 'Save these filters as a wish'));
    expect(byLabel(container, 'Name this wish').value).toBe('Batik, dark, strips (by width), at least 8 oz');
    await click(buttonNamed(container, 'Save wish'));

    await waitFor(() => expect(container.textContent).toContain('Wish saved: “Batik, dark, strips (by width), at least 8 oz”'));
    expect(posted).toEqual([
      { name: 'Batik, dark, strips (by width), at least 8 oz', filters: { fibre: 'batik', value: 'dark', cut: 'strips', minGrams: 227 } },
    ]);
    // Saved: the same filters are not offered again.
    await waitFor(() => expect(buttonNamed(container, /Saved as a wish/).disabled).toBe(true));
    expect(() => buttonNamed(container, 'Save these filters as a wish')).toThrow();
  });

  it('says the filters are already a wish, by its name, instead of offering to save them again', async () => {
    serveWishes([darkBatik]);
    const { container } = await renderPanel({ fibre: 'batik', value: 'dark' });
    const button = await waitFor(() => buttonNamed(container, /Saved as a wish/));
    expect(button.disabled).toBe(true);
    expect(document.getElementById(button.getAttribute('aria-describedby') ?? '')?.textContent).toContain('These filters are your wish “Dark batik”');
  });

  it('offers to save filters that differ from every wish, even by one filter', async () => {
    serveWishes([darkBatik]);
    const { container } = await renderPanel({ fibre: 'batik', value: 'dark', cut: 'strips' });
    await waitFor(() => expect(buttonNamed(container, 'Save these filters as a wish').disabled).toBe(false));
  });

  it('shows the API’s refusal of a twin saved elsewhere, and then the wish it has', async () => {
    const posted = serveWishes([], darkBatik);
    const { container } = await renderPanel({ fibre: 'batik', value: 'dark' });
    await click(await waitFor(() => buttonNamed(container, 'Save these filters as a wish')));
    await click(buttonNamed(container, 'Save wish'));
    await waitFor(() => expect(container.textContent).toContain('You already have a wish for these filters (Dark, Batik): “Dark batik”.'));
    expect(posted).toHaveLength(1);
    await click(buttonNamed(container, 'Cancel'));
    await waitFor(() => expect(buttonNamed(container, /Saved as a wish/).disabled).toBe(true));
  });

  it('cannot be used before a filter is chosen, and says why', async () => {
    serveWishes();
    const { container } = await renderPanel({});
    const button = buttonNamed(container, 'Save these filters as a wish');
    expect(button.disabled).toBe(true);
    expect(document.getElementById(button.getAttribute('aria-describedby') ?? '')?.textContent).toBe(
      'Choose at least one filter first, then save it as a wish.',
    );
  });
});
