// @vitest-environment happy-dom
import type { SessionUser } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import { VerifyEmailResult } from './verify-email-result.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The API's answer to a link that was used already. */
function serveUsedLink(user: SessionUser | null) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(user));
      if (path === '/api/email-verifications') {
        return jsonResponse(400, { error: { code: 'invalid_token', message: 'This link has expired or was already used. Ask for a new one.', fields: { token: 'Expired or used.' } } });
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
}

async function openLink(user: SessionUser | null) {
  serveUsedLink(user);
  const router = createMemoryRouter([{ path: '/verify-email', element: <VerifyEmailResult token="used-token" signedInUser={user} /> }], {
    initialEntries: ['/verify-email?token=used-token'],
  });
  const rendered = await render(
    <QueryClientProvider client={createQueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  await waitFor(() => expect(rendered.container.querySelector('[role="alert"], [role="status"], h2, p')).not.toBeNull());
  return rendered;
}

describe('opening the confirmation link again', () => {
  it('tells a signed-in, confirmed member their address is already confirmed', async () => {
    const { container } = await openLink(makeUser({ emailVerified: true }));
    await waitFor(() => expect(container.textContent).toContain('Your e-mail address is already confirmed'));
    expect(container.textContent).not.toContain('has been used or has expired');
    expect(container.textContent).toContain('Go to your home page');
  });

  it('still says the link is used up to a member whose address is not confirmed, and offers a new one', async () => {
    const { container } = await openLink(makeUser({ emailVerified: false }));
    await waitFor(() => expect(container.textContent).toContain('This link has been used or has expired'));
    expect(container.textContent).toContain('Send a new link');
  });

  it('says the link is used up to someone not signed in', async () => {
    const { container } = await openLink(null);
    await waitFor(() => expect(container.textContent).toContain('This link has been used or has expired'));
    expect(container.textContent).not.toContain('already confirmed');
  });
});
