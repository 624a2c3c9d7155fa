// @vitest-environment happy-dom
import type { SessionUser } from '@scrap-relay/shared';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, makeSession, makeUser, NO_ABILITIES } from '../../../testing/fixtures.ts';
import { buttonNamed, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { AppProvider, makeQueryClient } from '../../provider.tsx';
import { routes } from '../../router.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function serveSession(user: SessionUser) {
  const resent: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(user));
      if (path === '/api/email-verifications/resend' && init?.method === 'POST') {
        resent.push(path);
        return jsonResponse(202);
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return resent;
}

async function openHome() {
  const router = createMemoryRouter(routes, { initialEntries: ['/'] });
  const rendered = await render(
    <AppProvider queryClient={makeQueryClient()}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  await waitFor(() => expect(rendered.container.querySelector('h1')?.textContent).toContain('Welcome'));
  return rendered;
}

describe('the home page of a new quilter who has not confirmed their e-mail address', () => {
  // What the API gives such a member: no listing, buying or claiming until the address is confirmed.
  const unconfirmed = makeUser({ name: 'Wilma Ashdown', newQuilter: true, emailVerified: false, abilities: NO_ABILITIES });

  it('says plainly that confirming unlocks listing, buying and starter bundles, and names the pages waiting', async () => {
    serveSession(unconfirmed);
    const { container } = await openHome();
    const text = container.textContent ?? '';
    expect(text).toContain('Confirming it unlocks the exchange: listing a bundle, buying, and claiming starter bundles as a new quilter.');
    expect(text).toContain('Yes: once your e-mail address is confirmed, you may claim starter bundles');
    expect(text).not.toContain('Yes: you may claim starter bundles');
    expect(text).toContain('Once your e-mail address is confirmed: List a bundle, My bundles, Starter bundles.');
  });

  it('sends the confirmation again from the home page', async () => {
    const resent = serveSession(unconfirmed);
    const { container } = await openHome();
    await click(buttonNamed(container, 'Send the confirmation again'));
    await waitFor(() => expect(container.textContent).toContain(`We sent a new link to ${unconfirmed.email}`));
    expect(resent).toEqual(['/api/email-verifications/resend']);
  });

  it('says nothing of the kind to a confirmed member', async () => {
    serveSession(makeUser({ newQuilter: true, abilities: { ...NO_ABILITIES, listBundles: true, buy: true, claimStarter: true } }));
    const { container } = await openHome();
    const text = container.textContent ?? '';
    expect(text).toContain('Yes: you may claim starter bundles');
    expect(text).not.toContain('Once your e-mail address is confirmed');
    expect(text).not.toContain('Send the confirmation again');
  });
});
