// @vitest-environment happy-dom
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

function serveWishes() {
  const posted: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser()));
      if (path === '/api/wishes' && init?.method === 'POST') {
        const body = JSON.parse(String(init.body)) as { name: string; filters: Record<string, unknown> };
        posted.push(body);
        return jsonResponse(201, { wish: { id: 'w-1', ...body, createdAt: '2026-03-01T10:00:00.000Z' } });
      }
      return jsonResponse(200, { items: [] });
    }),
  );
  return posted;
}

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
