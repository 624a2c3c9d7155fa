// @vitest-environment happy-dom
import type { BundleView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { makeBundleView, makeSession, makeUser, testGuild } from '../../../testing/fixtures.ts';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';
import { cleanup, render } from '../../../testing/render.tsx';
import { BundleDetails } from './bundle-details.tsx';

afterEach(() => cleanup());

const NO_ACTIONS: BundleView['abilities'] = { edit: false, submit: false, withdraw: false, relist: false, review: false, buy: false, claim: false };

/** The bundle page as another member (not its seller) of a guild in `timeZone` sees it. */
async function openAsAnotherMember(bundle: BundleView, timeZone = testGuild.timeZone) {
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser()), guild: { ...testGuild, timeZone } });
  const { container } = await render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <BundleDetails bundle={bundle} units="metric" viewerId="member-hester" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return container;
}

/** The bundle's facts, term → detail. */
const facts = (root: HTMLElement) => Object.fromEntries([...root.querySelectorAll('dt')].map((dt) => [dt.textContent, dt.nextElementSibling?.textContent]));

describe('the bundle page', () => {
  it('shows a starter bundle offered to a waiting new quilter as kept for them, not as a shelf sale held at checkout', async () => {
    const container = await openAsAnotherMember(
      makeBundleView({ offer: 'starter', priceMinor: null, state: 'held', onShelfAt: '2026-11-05T10:00:00.000Z', abilities: NO_ACTIONS }),
    );

    expect(facts(container)).toMatchObject({
      Offer: 'Starter bundle',
      State: 'Kept for a new quilter on the waiting list',
      'Offered to new quilters since': expect.stringContaining('2026'),
    });
    expect(container.textContent).toContain('The new quilter first on the waiting list has been offered it and is deciding.');
    expect(container.textContent).not.toMatch(/checkout|On the shelf since|not on offer/);
  });

  it('keeps the shelf’s words for a sale bundle someone is paying for', async () => {
    const container = await openAsAnotherMember(makeBundleView({ state: 'held', onShelfAt: '2026-11-05T10:00:00.000Z', abilities: NO_ACTIONS }));

    expect(facts(container)).toMatchObject({ State: 'Held at checkout', 'On the shelf since': expect.stringContaining('2026') });
    expect(container.textContent).toContain('This bundle is not on offer at the moment.');
  });

  it('dates the shelf by the guild’s calendar', async () => {
    // 11:30 UTC on 30 November is already 1 December in Auckland (UTC+13 in the southern summer; IANA tz database).
    const bundle = makeBundleView({ onShelfAt: '2026-11-30T11:30:00.000Z', abilities: NO_ACTIONS });
    expect(facts(await openAsAnotherMember(bundle, 'Pacific/Auckland'))['On the shelf since']).toBe('December 1, 2026');
    cleanup();
    expect(facts(await openAsAnotherMember(bundle, 'America/Los_Angeles'))['On the shelf since']).toBe('November 30, 2026');
  });
});
