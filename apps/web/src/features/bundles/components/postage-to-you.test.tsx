// @vitest-environment happy-dom
import type { BundleView, PostalAddress } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeBundleView, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { makePostageQuote } from '../../../testing/postage.ts';
import { buttonNamed, byLabel, cleanup, click, render, typeInto, waitFor } from '../../../testing/render.tsx';
import { PostageToYou } from './postage-to-you.tsx';

const BUNDLE_ID = '0b7f1c52-6a0e-4c7e-9a51-3f0e8a6d2b11';
const VIEWER = 'member-hester';

const quote = makePostageQuote();

const savedAddress: PostalAddress = { name: 'Hester Quill', line1: '3 Loom Street', line2: '', town: 'Larkhollow', region: '', postalCode: '97451', country: 'US' };

/** The API as the panel sees it (the session too, for the CSRF token a POST carries); every quote asked for is kept, and answered with `quoteAnswer`. */
function serveApi(address: PostalAddress | null, quoteAnswer: () => Response = () => jsonResponse(200, quote)) {
  const asked: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser({ id: VIEWER })));
      if (path === '/api/me/address') return jsonResponse(200, { address });
      if (path === '/api/postage-quotes' && init?.method === 'POST') {
        asked.push(JSON.parse(String(init.body)));
        return quoteAnswer();
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return { asked };
}

async function openPanel(bundle: BundleView) {
  const { container } = await render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <PostageToYou bundle={bundle} units="imperial" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return container;
}

const saleBundle = (overrides: Partial<BundleView> = {}) => makeBundleView({ id: BUNDLE_ID, priceMinor: 1200, weightGrams: 454, ...overrides });

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('postage to you on the bundle page', () => {
  it('quotes one of the bundle to the saved address at once, with the working and the basket’s combining', async () => {
    const { asked } = serveApi(savedAddress);
    const container = await openPanel(saleBundle());

    await waitFor(() => expect(container.querySelector('[role="status"]')?.textContent).toBe('To 97451, US (your saved address)$7.30'));
    expect(asked).toEqual([{ items: [{ bundleId: BUNDLE_ID, quantity: 1 }], destination: { country: 'US', postalCode: '97451' } }]);
    expect(container.textContent).toContain('With the price of the bundle: $19.30.');
    expect(container.textContent).toContain('Padded mailer');
    expect(container.querySelector('summary')?.textContent).toBe('How the postage was worked out');
    expect(container.textContent).toContain('Bundles from one seller go in one parcel, so in your basket the postage per bundle may come to less.');
    expect(container.textContent).not.toContain('Save your postal address');
  });

  it('asks a member with no saved address for a postal code, and quotes to what they give', async () => {
    const { asked } = serveApi(null);
    const container = await openPanel(saleBundle({ offer: 'postage_only', priceMinor: null }));

    const postalCode = await waitFor(() => byLabel(container, 'Postal code'));
    expect(byLabel(container, 'Country').value).toBe('US');
    expect(asked).toEqual([]);
    await typeInto(postalCode, '98101');
    await click(buttonNamed(container, 'Show the postage'));

    await waitFor(() => expect(container.querySelector('[role="status"]')?.textContent).toBe('To 98101, US$7.30'));
    expect(asked).toEqual([{ items: [{ bundleId: BUNDLE_ID, quantity: 1 }], destination: { country: 'US', postalCode: '98101' } }]);
    expect(container.textContent).toContain('The bundle itself is free: the postage is all you pay.');
    expect(container.querySelector('a')?.textContent).toBe('Save your postal address');
  });

  it('says plainly when the guild’s table does not cover the country', async () => {
    const message = 'The guild’s postage table has rates for US only, not CA.';
    serveApi({ ...savedAddress, country: 'CA', postalCode: 'K0A 1A0' }, () =>
      jsonResponse(422, { error: { code: 'unprocessable', message, fields: { 'destination.country': message } } }),
    );
    const container = await openPanel(saleBundle());

    await waitFor(() => expect(container.textContent).toContain('No postage quote to K0A 1A0, CA (your saved address)'));
    expect(container.textContent).toContain(message);
    expect(container.textContent).not.toContain('Collect it at a guild meeting');
  });

  it('points to a meeting handover when the bundle is too heavy to post and may be collected', async () => {
    const message = '“Dark batik 2½-inch strips” weighs 9.5 kg; the largest package (Medium box) holds 9 kg. Choose handover at a meeting instead.';
    serveApi(savedAddress, () => jsonResponse(422, { error: { code: 'unprocessable', message, fields: { items: message } } }));
    const container = await openPanel(saleBundle({ meetingHandoverOk: true }));

    await waitFor(() => expect(container.textContent).toContain(message));
    expect(container.textContent).toContain('In your basket, choose “Collect it at a guild meeting”: there is no postage to pay.');
  });

  it('shows nothing on the member’s own bundle, a meeting or starter bundle, or one they may not buy', async () => {
    serveApi(savedAddress);
    for (const bundle of [
      // The member's own bundle, as the API presents it to them: no `buy` ability.
      saleBundle({
        seller: { id: VIEWER, firstName: 'Hester', rehomedCount: 0, returnedCount: 0 },
        abilities: { edit: false, submit: false, withdraw: true, relist: false, review: false, buy: false, claim: false },
      }),
      saleBundle({ offer: 'meeting', priceMinor: null }),
      saleBundle({ offer: 'starter', priceMinor: null }),
      saleBundle({ abilities: { edit: false, submit: false, withdraw: false, relist: false, review: false, buy: false, claim: false } }),
    ]) {
      const container = await openPanel(bundle);
      expect(container.textContent).toBe('');
      cleanup();
    }
  });
});
