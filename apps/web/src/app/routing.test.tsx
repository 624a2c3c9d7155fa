// @vitest-environment happy-dom
import type { SessionUser } from '@scrap-relay/shared';
import { act, StrictMode } from 'react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ADMIN_ABILITIES, jsonResponse, makeMember, makeSession, makeUser } from '../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../testing/render.tsx';
import { AppProvider, makeQueryClient } from './provider.tsx';
import { routes } from './router.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The API as these pages see it: a session for `user`, and the member list. */
function serveApi(user: SessionUser | null) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(user));
      if (path === '/api/members') return jsonResponse(200, { items: [makeMember(1), makeMember(2)] });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
}

async function openApp(url: string) {
  const router = createMemoryRouter(routes, { initialEntries: [url] });
  const rendered = await render(
    <AppProvider queryClient={makeQueryClient()}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { router, ...rendered };
}

const heading = (root: HTMLElement) => root.querySelector('h1')?.textContent;
const navLabels = (root: HTMLElement) => [...root.querySelectorAll('nav[aria-label="Main"] a')].map((a) => a.textContent);
/** Each list in the menu by the name its section heading gives it, with its links. */
const navSections = (root: HTMLElement) =>
  [...root.querySelectorAll<HTMLUListElement>('nav[aria-label="Main"] ul[aria-labelledby]')].map((list) => [
    root.querySelector(`[id="${list.getAttribute('aria-labelledby')}"]`)?.textContent,
    [...list.querySelectorAll('a')].map((a) => a.textContent),
  ]);
const currentLinks = (root: HTMLElement) => [...root.querySelectorAll('nav[aria-label="Main"] a[aria-current="page"]')].map((a) => a.textContent);

const MEMBER_EXCHANGE = ['Home', 'Shelf', 'Wishes', 'List a bundle', 'My bundles', 'Basket', 'Orders', 'Meetings', 'Dashboard'];

describe('route guards', () => {
  it('sends a signed-out visitor to sign in, remembering where they were going', async () => {
    serveApi(null);
    const { router, container } = await openApp('/admin/members');

    await waitFor(() => expect(heading(container)).toBe('Sign in'));
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?redirectTo=%2Fadmin%2Fmembers');
    expect(navLabels(container)).toEqual([]);
  });

  it('tells a member plainly that an officer page is not for their account', async () => {
    serveApi(makeUser());
    const { router, container } = await openApp('/admin/members');

    await waitFor(() => expect(heading(container)).toBe('Not available for your account'));
    expect(router.state.location.pathname).toBe('/admin/members');
    expect(navSections(container)).toEqual([
      ['Exchange', MEMBER_EXCHANGE],
      ['You', ['Profile', 'Account']],
    ]);
    expect(currentLinks(container)).toEqual([]);
  });

  it('tells a member who is not a new quilter that starter bundles are for new quilters, and how to give one', async () => {
    serveApi(makeUser());
    const { router, container } = await openApp('/starter');

    await waitFor(() => expect(heading(container)).toBe('Starter bundles are for new quilters'));
    expect(router.state.location.pathname).toBe('/starter');
    expect(container.textContent).toContain('New quilters are members who joined the guild within its newcomer window, or whom the librarian has flagged as new.');
    expect(container.textContent).not.toContain('guild officers');
    const give = [...container.querySelectorAll('main a')].find((a) => a.textContent === 'Give a starter bundle');
    expect(give?.getAttribute('href')).toBe('/my-bundles/new');
  });

  it('opens the members page for an account that may manage members', async () => {
    serveApi(makeUser({ roles: ['member', 'admin'], abilities: ADMIN_ABILITIES }));
    const { container } = await openApp('/admin/members');

    await waitFor(() => expect(container.textContent).toContain('Showing 1–2 of 2 members'));
    expect(heading(container)).toBe('Members');
    expect(navSections(container)).toEqual([
      ['Exchange', MEMBER_EXCHANGE],
      ['Guild office', ['Members', 'Guild settings', 'Postage table']],
      ['You', ['Profile', 'Account']],
    ]);
    expect(currentLinks(container)).toEqual(['Members']);
  });

  it('sends a signed-in member away from the sign-in page to where they were headed', async () => {
    serveApi(makeUser());
    const { router } = await openApp('/sign-in?redirectTo=%2Faccount');

    await waitFor(() => expect(router.state.location.pathname).toBe('/account'));
  });

  it('answers an unknown address with a not-found page', async () => {
    serveApi(makeUser());
    const { container } = await openApp('/no/such/page');
    await waitFor(() => expect(heading(container)).toBe('Page not found'));
  });
});

describe('focus between pages', () => {
  // StrictMode runs a mount effect twice in development; the first page must still keep its focus where the browser put it.
  it('leaves the first page alone and moves focus to the next page’s heading once', async () => {
    serveApi(makeUser({ roles: ['member', 'admin'], abilities: ADMIN_ABILITIES }));
    const router = createMemoryRouter(routes, { initialEntries: ['/admin/members'] });
    const { container } = await render(
      <StrictMode>
        <AppProvider queryClient={makeQueryClient()}>
          <RouterProvider router={router} />
        </AppProvider>
      </StrictMode>,
    );
    await waitFor(() => expect(heading(container)).toBe('Members'));
    expect(document.activeElement).toBe(document.body);

    const focused: string[] = [];
    const onFocus = (event: FocusEvent) => focused.push((event.target as HTMLElement).textContent ?? '');
    document.addEventListener('focusin', onFocus);
    await act(async () => router.navigate('/account'));
    await waitFor(() => expect(heading(container)).toBe('Your account'));
    document.removeEventListener('focusin', onFocus);
    expect(document.activeElement).toBe(container.querySelector('h1'));
    expect(focused).toEqual(['Your account']);
  });
});
