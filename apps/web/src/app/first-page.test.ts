// @vitest-environment happy-dom
import { type BundleCard, CARD_PHOTO_SIZES, type Page, readShelfSearch, shelfQueryFor } from '@scrap-relay/shared';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { getSessionQueryOptions } from '../features/auth/api/get-session.ts';
import { getShelfQueryOptions } from '../features/shelf/api/get-shelf.ts';
import { jsonResponse, makeBundleCard, makeSession, makeUser } from '../testing/fixtures.ts';
import { followSignedIn, startFirstPage } from './first-page.ts';
import { makeQueryClient } from './provider.tsx';

const card = makeBundleCard();

/** The API: the session says whether a member is signed in; the shelf answers one card. Records what was asked. */
function serveApi({ signedIn }: { signedIn: boolean }) {
  const asked: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const url = new URL(String(input), 'http://app.test');
      asked.push(url.pathname + url.search);
      if (url.pathname === '/api/session') return jsonResponse(200, makeSession(signedIn ? makeUser() : null));
      if (url.pathname === '/api/bundles') {
        if (!signedIn) return jsonResponse(401, { error: { code: 'unauthenticated', message: 'Please sign in.' } });
        const page: Page<BundleCard> = { items: [card], page: 2, pageSize: 24, total: 25 };
        return jsonResponse(200, page);
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return asked;
}

/** A session read in an earlier visit, as the app reads it: the hint follows it. */
async function readSessionOnce(signedIn: boolean) {
  const client = makeQueryClient();
  const stop = followSignedIn(client);
  serveApi({ signedIn });
  await client.fetchQuery(getSessionQueryOptions());
  stop();
}

beforeEach(() => localStorage.clear());
afterEach(() => {
  vi.unstubAllGlobals();
  document.head.querySelectorAll('link[rel="preload"]').forEach((link) => link.remove());
});

describe('the early start of a cold load', () => {
  it('asks for the shelf page the address names, under the key the shelf page reads, when the last session had a member', async () => {
    await readSessionOnce(true);
    const asked = serveApi({ signedIn: true });
    const client = makeQueryClient();

    startFirstPage(client, { pathname: '/shelf', search: '?fibre=batik&page=2&sort=price_asc' });

    const key = getShelfQueryOptions(shelfQueryFor(readShelfSearch(new URLSearchParams('fibre=batik&page=2&sort=price_asc')))).queryKey;
    await vi.waitFor(() => expect(client.getQueryData(key)?.items).toHaveLength(1));
    expect(asked).toEqual(['/api/bundles?fibre=batik&sort=price_asc&page=2&pageSize=24']);
  });

  it("preloads the first card's photo with the card's own srcset and sizes", async () => {
    await readSessionOnce(true);
    serveApi({ signedIn: true });

    startFirstPage(makeQueryClient(), { pathname: '/shelf', search: '' });

    const link = await vi.waitFor(() => {
      const found = document.head.querySelector<HTMLLinkElement>('link[rel="preload"][as="image"]');
      expect(found).not.toBeNull();
      return found!;
    });
    expect(link.getAttribute('href')).toBe('/uploads/photos/b-1-400.webp');
    expect(link.getAttribute('imagesrcset')).toBe('/uploads/photos/b-1-400.webp 400w, /uploads/photos/b-1-800.webp 800w');
    expect(link.getAttribute('imagesizes')).toBe(CARD_PHOTO_SIZES);
  });

  it('asks for no bundles when the last session read had no member, so a visitor goes to sign in without a refused request', async () => {
    await readSessionOnce(true);
    await readSessionOnce(false);
    const asked = serveApi({ signedIn: false });

    startFirstPage(makeQueryClient(), { pathname: '/shelf', search: '' });
    await new Promise((resolve) => setTimeout(resolve, 50));

    expect(asked).toEqual([]);
  });

  it('starts nothing for other pages', async () => {
    await readSessionOnce(true);
    const asked = serveApi({ signedIn: true });
    const client = makeQueryClient();

    startFirstPage(client, { pathname: '/wishes', search: '?fibre=batik' });
    await new Promise((resolve) => setTimeout(resolve, 50));

    expect(asked).toEqual([]);
    expect(client.getQueryCache().getAll()).toEqual([]);
  });
});
