// @vitest-environment happy-dom
import type { BundleView, MeetingView } from '@scrap-relay/shared';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProvider, makeQueryClient } from '../../../app/provider.tsx';
import { jsonResponse, makeBundleView, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { buttonNamed, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import type { StarterBundlesResponse } from '../types.ts';
import { StarterProgramme } from './starter-programme.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const meeting: MeetingView = { id: 'mt-1', startsAt: '2031-03-13T19:00:00Z', place: 'Larkhollow chapel room', notes: '', abilities: { edit: false } };

const starterBundle = (): BundleView =>
  makeBundleView({
    id: 'b-1',
    title: 'Starter bag of lawn squares',
    offer: 'starter',
    priceMinor: null,
    currency: 'GBP',
    weightGrams: 300,
    fibre: 'lawn_voile',
    cutKinds: ['squares'],
    colour: { value: 'light', family: 'cool', suggested: null },
    disclosures: { smokeFree: true, petFree: false },
    seller: { id: 's-1', firstName: 'Mabel', rehomedCount: 3, returnedCount: 0 },
    onShelfAt: '2031-03-01T10:00:00Z',
    photos: [
      {
        id: 'p-1',
        url: '/uploads/photos/p-1-1600.webp',
        mediumUrl: '/uploads/photos/p-1-800.webp',
        thumbUrl: '/uploads/photos/p-1-400.webp',
        width: 1600,
        height: 1200,
        averageHex: '#b8c4d0',
      },
    ],
    abilities: { edit: false, submit: false, withdraw: false, relist: false, review: false, buy: false, claim: true },
  });

/** The API for one new quilter: one free bundle at first; the claim loses the race; then nothing is free. */
function serveApi() {
  let free = true;
  const calls: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = new URL(String(input), 'http://app.test');
      const method = init?.method ?? 'GET';
      calls.push(`${method} ${url.pathname}${method === 'POST' ? ` ${String(init?.body)}` : ''}`);
      if (url.pathname === '/api/session') return jsonResponse(200, makeSession(makeUser({ newQuilter: true })));
      if (url.pathname === '/api/meetings') return jsonResponse(200, { items: [meeting] });
      if (url.pathname === '/api/starter-bundles') {
        const body: StarterBundlesResponse = {
          status: { rules: { limitPerWindow: 1, windowDays: 90, offerHours: 72, postingAllowed: false }, eligibility: { eligible: true }, waitlist: null, offer: null, claims: [] },
          items: free ? [starterBundle()] : [],
        };
        return jsonResponse(200, body);
      }
      if (url.pathname === '/api/starter-bundles/b-1/claims') {
        free = false;
        return jsonResponse(409, { error: { code: 'conflict', message: 'Someone else claimed that one a moment ago.', fields: { bundleId: 'Already claimed.' } } });
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return calls;
}

describe('claiming a starter bundle', () => {
  it('sends the chosen meeting, and when someone else was quicker says so and offers the waiting list', async () => {
    const calls = serveApi();
    const { container } = await render(
      <AppProvider queryClient={makeQueryClient()}>
        <MemoryRouter>
          <StarterProgramme units="metric" runsProgramme={false} canGive={false} />
        </MemoryRouter>
      </AppProvider>,
    );
    await waitFor(() => expect(container.textContent).toContain('Starter bag of lawn squares'));
    expect(container.textContent).toContain('Lawn / voile');
    expect(container.textContent).toContain('300 g');
    expect(container.textContent).toContain('pets live there');
    // Every stored size is offered, so a phone with a sharp screen is not shown the 400 px thumbnail blown up.
    const photo = container.querySelector('img[alt^="Photo of the starter bundle"]');
    expect(photo?.getAttribute('srcset')).toBe('/uploads/photos/p-1-400.webp 400w, /uploads/photos/p-1-800.webp 800w, /uploads/photos/p-1-1600.webp 1600w');

    await click(buttonNamed(container, /^Claim/));
    const select = await waitFor(() => {
      const found = container.querySelector<HTMLSelectElement>('dialog select');
      if (!found) throw new Error('No meeting choice yet');
      return found;
    });
    // The next meeting once, by its date and place, chosen to begin with (not "The next meeting" and then the same meeting again).
    expect([...select.options].map((o) => o.textContent)).toEqual([expect.stringContaining('Larkhollow chapel room')]);
    expect(select.value).toBe('mt-1');
    select.value = 'mt-1';
    select.dispatchEvent(new Event('change', { bubbles: true }));
    await click(buttonNamed(container, 'Claim it'));

    await waitFor(() => expect(container.textContent).toContain('Someone else claimed it a moment ago'));
    expect(calls).toContain('POST /api/starter-bundles/b-1/claims {"meetingId":"mt-1"}');
    await waitFor(() => expect(buttonNamed(container, 'Join the waiting list')).toBeTruthy());
    expect(container.textContent).not.toContain('Starter bag of lawn squares');
  });
});
