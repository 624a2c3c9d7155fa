import type { QueryClient } from '@tanstack/react-query';
import { readShelfSearch, type SessionResponse, shelfQueryFor } from '@scrap-relay/shared';
import { paths } from '../config/paths.ts';
import { sessionQueryKey } from '../features/auth/api/get-session.ts';
import { getShelfQueryOptions } from '../features/shelf/api/get-shelf.ts';
import { preloadCardPhoto } from '../features/shelf/utils/card-photo.ts';

/** The shelf's route module, for the router and for an early start (one function, so both share the module). */
export const loadShelfPage = () => import('./routes/app/shelf/shelf.tsx');

/**
 * On a cold load the shelf waits in a chain: entry chunk → session → route chunk → bundles → photos. When the
 * first address is the shelf, its route chunk and (for a member who is probably signed in) its first page are
 * asked for at once, beside the session, with the same module and the same query the page itself uses, so the
 * page finds both in flight; the first card's photo follows as soon as the page of bundles arrives. A visitor
 * who is not signed in asks only for the chunk: the guard sends them to sign in as before, without a refused
 * request first. Imports neither React DOM nor the router (see start.ts).
 */
export function startFirstPage(queryClient: QueryClient, { pathname, search }: Pick<Location, 'pathname' | 'search'>): void {
  if (pathname.replace(/(.)\/+$/, '$1') !== paths.app.shelf.path) return;
  // The bundles go first: a browser opens six connections to a server, and the route chunk with the small
  // chunks it imports would otherwise take every one the session left, so the bundles, and the first
  // card's photo after them, waited for a chunk to finish (about 0.2 s on a slow connection).
  if (seemsSignedIn()) {
    const shelf = getShelfQueryOptions(shelfQueryFor(readShelfSearch(new URLSearchParams(search))));
    void queryClient.prefetchQuery(shelf).then(() => {
      // The first card's photo can start now, while the page is still being drawn.
      const first = queryClient.getQueryData(shelf.queryKey)?.items[0];
      if (first) preloadCardPhoto(first);
    });
  }
  void loadShelfPage();
}

/** Whether the last session this browser read had a member: a hint only, the session itself still decides. */
const SIGNED_IN_HINT = 'scrap-relay.signed-in';

function seemsSignedIn(): boolean {
  try {
    return localStorage.getItem(SIGNED_IN_HINT) === '1';
  } catch {
    return false;
  }
}

/** Keeps the hint in step with every session the app reads or sets (sign-in, sign-out, expiry). */
export function followSignedIn(queryClient: QueryClient): () => void {
  return queryClient.getQueryCache().subscribe((event) => {
    if (event.type !== 'updated' || event.action.type !== 'success' || event.query.queryKey[0] !== sessionQueryKey[0]) return;
    const session = event.query.state.data as SessionResponse | undefined;
    try {
      if (session?.user) localStorage.setItem(SIGNED_IN_HINT, '1');
      else localStorage.removeItem(SIGNED_IN_HINT);
    } catch {
      // Storage refused (private mode, quota): the shelf then waits for the session as before.
    }
  });
}
