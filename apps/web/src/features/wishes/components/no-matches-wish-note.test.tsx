// @vitest-environment happy-dom
import type { WishView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import { wishWithFilters } from '../utils/same-filters.ts';
import { NoMatchesWishNote } from './no-matches-wish-note.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const selvages: WishView = { id: 'w-1', name: 'Selvages under a pound', filters: { maxGrams: 454, cut: 'selvages' }, createdAt: '2026-02-01T10:00:00.000Z' };

async function renderNote(filters: Parameters<typeof NoMatchesWishNote>[0]['filters']) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser()));
      if (path === '/api/wishes') return jsonResponse(200, { items: [selvages] });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <NoMatchesWishNote filters={filters} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('an empty shelf and the member’s wishes', () => {
  it('does not suggest saving filters that are already a wish, and names it', async () => {
    const { container } = await renderNote({ cut: 'selvages', maxGrams: 454 });
    await waitFor(() => expect(container.textContent).toContain('These are already your wish “Selvages under a pound”'));
    expect(container.textContent).not.toContain('save these as a wish');
  });

  it('suggests saving filters that are not a wish yet', async () => {
    const { container } = await renderNote({ cut: 'selvages' });
    await waitFor(() => expect(container.textContent).toContain('save these as a wish'));
  });
});

describe('filters that are the same wish', () => {
  it('are the same whatever their order, with empty ones left out and numbers read as numbers', () => {
    expect(wishWithFilters([selvages], { maxGrams: 454, cut: 'selvages', q: '' })).toBe(selvages);
    expect(wishWithFilters([{ ...selvages, filters: { maxGrams: '454', cut: 'selvages' } }], { cut: 'selvages', maxGrams: 454 })?.id).toBe('w-1');
    expect(wishWithFilters([selvages], { cut: 'selvages', maxGrams: 455 })).toBeUndefined();
    expect(wishWithFilters([selvages], {})).toBeUndefined();
  });
});
