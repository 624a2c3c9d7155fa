// @vitest-environment happy-dom
import type { LedgerEntryView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';
import { jsonResponse, makeSession, makeUser, testGuild } from '../../../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import { ledgerDirection } from '../utils/labels.ts';
import { LedgerView } from './ledger-view.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const entry = (id: string, kind: string, account: string, accountLabel: string, amountMinor: number, order: boolean): LedgerEntryView => ({
  id,
  transactionId: 'tx-0001-aaaa',
  createdAt: '2026-03-02T10:22:00.000Z',
  kind,
  reverses: null,
  account,
  accountLabel,
  amountMinor,
  currency: 'USD',
  orderId: order ? 'o-41' : null,
  orderReference: order ? 'SR-HHTFTE' : null,
  payoutId: null,
});

/** One card payment of $27.90 shared out (the ledger's own example), and a payout with no order. */
const entries: LedgerEntryView[] = [
  entry('1', 'charge', 'buyer', 'Buyers (card payments)', -2790, true),
  entry('2', 'seller_credit', 'seller:s-1', 'Seller: Orla Finch', 2615, true),
  entry('3', 'guild_fee', 'guild', 'Guild funds', 175, true),
  entry('4', 'payout', 'seller:s-1', 'Seller: Orla Finch', -1000, false),
];

/** The ledger as a treasurer of a guild in `timeZone` sees it (the session already loaded, as the app's guard leaves it). */
async function renderLedger(timeZone = testGuild.timeZone) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser({ roles: ['member', 'treasurer'] })));
      if (path === '/api/ledger') return jsonResponse(200, { items: entries });
      if (path === '/api/orders') return jsonResponse(200, { items: [] });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser({ roles: ['member', 'treasurer'] })), guild: { ...testGuild, timeZone } });
  const rendered = await render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <LedgerView filters={{}} onFiltersChange={() => undefined} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  await waitFor(() => expect(rendered.container.textContent).toContain('Showing 1–4 of 4 entries'));
  return rendered;
}

describe('the ledger', () => {
  it('links each order reference to the order, where the treasurer refunds it', async () => {
    const { container } = await renderLedger();
    const links = [...container.querySelectorAll<HTMLAnchorElement>('a[href^="/orders/"]')];
    expect(links).toHaveLength(3);
    expect(links.every((link) => link.getAttribute('href') === '/orders/o-41')).toBe(true);
    expect(links[0]!.textContent).toBe('Open order SR-HHTFTE');
  });

  it('says which way each amount went, so a card payment received does not read as money lost', async () => {
    const { container } = await renderLedger();
    const rows = [...container.querySelectorAll('tbody tr')].map((row) => row.textContent ?? '');
    const payment = rows.find((row) => row.includes('Card payment'))!;
    expect(payment).toContain('-$27.90');
    expect(payment).toContain('received from the buyer');
    expect(rows.find((row) => row.includes('Seller credit'))).toContain('owed to the seller');
    expect(rows.find((row) => row.includes('Guild fee'))).toContain('to the guild');
    expect(container.querySelector('th')?.parentElement?.textContent).toContain('Amount, in or out');
    // Red is for nothing here: the words carry the direction.
    expect(container.querySelector('tbody .text-madder-deep')).toBeNull();
  });

  it('gives each entry’s time, and reads the date filters, in the guild’s time zone, whatever the device’s', async () => {
    // 10:22 UTC on 2 March 2026 is 11:22 PM the same day in Auckland, UTC+13 until summer time ends on 5 April
    // (IANA tz database, Pacific/Auckland).
    const { container } = await renderLedger('Pacific/Auckland');
    const times = [...container.querySelectorAll('tbody time')].map((time) => time.textContent);
    expect(times).toHaveLength(4);
    expect(new Set(times)).toEqual(new Set(['Mar 2, 2026, 11:22 PM GMT+13']));
    const filters = container.querySelector('[role="search"]')!;
    expect(filters.textContent).toContain('Days run from midnight to midnight in the guild’s time zone');
    expect(filters.textContent).toContain('(Pacific/Auckland)');
  });
});

describe('the direction of a ledger amount', () => {
  it('reads the sign for the account it is on', () => {
    expect(ledgerDirection('buyer', -2790)).toBe('received from the buyer');
    expect(ledgerDirection('buyer', 1370)).toBe('paid back to the buyer');
    expect(ledgerDirection('seller:s-1', -1320)).toBe('no longer owed to the seller');
    expect(ledgerDirection('payouts', 2615)).toBe('paid out');
    expect(ledgerDirection('processor', 70)).toBe('kept by the card processor');
    expect(ledgerDirection('guild', -70)).toBe('from the guild');
  });
});
