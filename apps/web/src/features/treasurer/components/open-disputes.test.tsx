// @vitest-environment happy-dom
import type { OrderView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';
import { jsonResponse, makeSession, makeUser, testGuild } from '../../../testing/fixtures.ts';
import { makeOrderView } from '../../../testing/orders.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import { ledgerDirection, ledgerKindText } from '../utils/labels.ts';
import { OpenDisputes } from './open-disputes.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const disputed: OrderView = makeOrderView({
  id: 'o-41',
  reference: 'SR-HHTFTE',
  state: 'posted',
  viewerIs: 'officer',
  seller: { id: 's-1', name: 'Orla Vance', email: null },
  buyer: { id: 'b-1', name: 'Maud Tilling', email: null },
  dispute: {
    stage: 'open',
    status: 'under_review',
    amountMinor: 1930,
    reason: 'product_unacceptable',
    openedAt: '2026-11-20T17:00:00.000Z',
    evidenceDueBy: '2026-11-27T23:59:59.000Z',
    feeMinor: 1500,
    closedAt: null,
  },
});

async function renderOpenDisputes(items: OrderView[]) {
  const requested: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const url = new URL(String(input), 'http://app.test');
      requested.push(`${url.pathname}${url.search}`);
      if (url.pathname === '/api/orders') return jsonResponse(200, { items });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser({ roles: ['member', 'treasurer'] })), guild: { ...testGuild, timeZone: 'America/Los_Angeles' } });
  const rendered = await render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <OpenDisputes />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  await waitFor(() => expect(requested).toEqual(['/api/orders?as=treasurer&disputes=open']));
  return rendered;
}

describe('open disputes above the ledger', () => {
  it('lists each disputed payment with its order, amount, reason, stage and deadline', async () => {
    const { container } = await renderOpenDisputes([disputed]);
    await waitFor(() => expect(container.querySelector('h2')?.textContent).toBe('A card payment is disputed'));
    const link = container.querySelector<HTMLAnchorElement>('a[href="/orders/o-41"]');
    expect(link?.textContent).toBe('Order SR-HHTFTE');
    const item = container.querySelector('li')?.textContent ?? '';
    expect(item).toContain('Orla Vance to Maud Tilling');
    expect(item).toContain('$19.30');
    expect(item).toContain('The buyer says the bundles were not as described');
    expect(item).toContain('Answered: the bank is deciding');
    // 23:59:59 UTC on 27 November is 3:59 PM that day in Los Angeles (UTC−8 in winter, IANA tz database).
    expect(item).toMatch(/Evidence due by .*Nov 27.*3:59 PM/);
  });

  it('shows nothing when no payment is disputed', async () => {
    const { container } = await renderOpenDisputes([]);
    await waitFor(() => expect(container.textContent).toBe(''));
  });
});

describe('a lost dispute in the ledger', () => {
  it('names what was taken back, and which way the money went', () => {
    expect(ledgerKindText('dispute', 'seller_credit')).toBe('Seller credit taken back (dispute lost)');
    expect(ledgerKindText('dispute', 'guild_fee')).toBe('Guild fee taken back (dispute lost)');
    expect(ledgerKindText('dispute', null)).toBe('Dispute lost');
    expect(ledgerDirection('processor', 1930, 'dispute')).toBe('taken back through the card processor');
    expect(ledgerDirection('processor', 86, 'processing_cost')).toBe('kept by the card processor');
  });

  it('names the card processor’s dispute fee, charged and given back', () => {
    expect(ledgerKindText('dispute_fee', null)).toBe('Dispute fee');
    expect(ledgerDirection('processor', 1500, 'dispute_fee')).toBe('kept by the card processor');
    expect(ledgerDirection('processor', -1500, 'dispute_fee')).toBe('returned by the card processor');
    expect(ledgerDirection('guild', -1500, 'dispute_fee')).toBe('from the guild');
  });
});
