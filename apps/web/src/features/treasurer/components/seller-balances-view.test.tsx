// @vitest-environment happy-dom
import type { SellerBalanceView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { SellerBalancesView } from './seller-balances-view.tsx';

/** A seller's balance as the API sends it: what waits is credit for bags not yet sent; the rest of the balance is payable. */
const balance = (
  name: string,
  { creditedMinor, paidOutMinor = 0, waitingMinor = 0 }: { creditedMinor: number; paidOutMinor?: number; waitingMinor?: number },
  sellerId = `id-${name}`,
): SellerBalanceView => ({
  sellerId,
  name,
  creditedMinor,
  paidOutMinor,
  balanceMinor: creditedMinor - paidOutMinor,
  payableMinor: creditedMinor - paidOutMinor - waitingMinor,
  waitingMinor,
  currency: 'USD',
});

/** Serves the balances, and answers a payout as the API does when it is above what is payable. */
function serveBalances(items: SellerBalanceView[]) {
  const fetch = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const path = new URL(String(input), 'http://app.test').pathname;
    if (path === '/api/session') return jsonResponse(200, makeSession(makeUser({ roles: ['member', 'treasurer'] })));
    if (path === '/api/seller-balances') return jsonResponse(200, { items });
    if (path === '/api/payouts' && init?.method === 'POST') {
      return jsonResponse(422, { error: { code: 'unprocessable', message: 'That is more than the guild can pay out.', fields: { amountMinor: 'More than the $13.60 payable now.' } } });
    }
    return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
  });
  vi.stubGlobal('fetch', fetch);
  return fetch;
}

async function renderBalances() {
  const { container } = await render(
    <QueryClientProvider client={createQueryClient()}>
      <SellerBalancesView />
    </QueryClientProvider>,
  );
  await waitFor(() => expect(container.textContent).toContain('The guild owes sellers'));
  return container;
}

/** The text of the table row (or phone card) that names the seller. */
const rowOf = (container: HTMLElement, name: string) =>
  [...container.querySelectorAll('tr')].find((row) => row.textContent?.includes(name))?.textContent ?? '';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('seller balances', () => {
  it('shows a seller refunded after a payout as owing the guild, and totals that agree with the month statement', async () => {
    // Orla may be paid $29.10. Piet was paid out his $17.30, then a refund took $4.50 of his credits back: he owes $4.50.
    serveBalances([balance('Orla Finch', { creditedMinor: 2910 }), balance('Piet Marsh', { creditedMinor: 1280, paidOutMinor: 1730 })]);
    const container = await renderBalances();

    expect(container.textContent).toContain('The guild owes sellers $29.10 in all: $29.10 can be paid out now.');
    expect(container.textContent).toContain('Piet Marsh owes the guild $4.50');
    expect(rowOf(container, 'Piet Marsh')).toContain('Owes the guild $4.50, from a refund after a payout');
    expect(container.textContent).toContain('total owed to sellers, which nets it off, is $24.60');
    expect(container.textContent).not.toContain('Nothing owed');
  });

  it('keeps credit for a bag not yet sent out of the payable figure, and says why', async () => {
    // Hetty's only sale ($18.10 credit) is paid but not posted. Orla has $13.60 payable and another $18.10 waiting.
    serveBalances([
      balance('Hetty Blanchard', { creditedMinor: 1810, waitingMinor: 1810 }),
      balance('Orla Finch', { creditedMinor: 3170, waitingMinor: 1810 }),
    ]);
    const container = await renderBalances();

    expect(container.textContent).toContain('The guild owes sellers $49.80 in all: $13.60 can be paid out now, and $36.20 is waiting for bags to go out.');
    expect(container.textContent).toContain('when the seller marks the parcel posted, or the bag is ticked off as handed over at a meeting');
    expect(rowOf(container, 'Hetty Blanchard')).toContain('$0.00');
    expect(rowOf(container, 'Hetty Blanchard')).toContain('$18.10');
    expect(rowOf(container, 'Hetty Blanchard')).toContain('Nothing to pay until the bags go out');
    expect(() => buttonNamed(container, 'Record a payout to Hetty Blanchard')).toThrow();
    // Only a seller with something payable is offered in the payout form.
    const sellers = [...byLabel<HTMLSelectElement>(container, 'Seller').options].map((option) => option.textContent);
    expect(sellers).toEqual(['Choose a seller', 'Orla Finch ($13.60)']);
  });

  it('offers the payable figure as the payout, and shows the refusal of a larger one on the amount', async () => {
    // A payout form sends a real seller id (the shared schema checks it).
    const orlaId = '6f1c2a3b-4d5e-4f60-8a71-92b3c4d5e6f7';
    const fetch = serveBalances([balance('Orla Finch', { creditedMinor: 3170, waitingMinor: 1810 }, orlaId)]);
    const container = await renderBalances();

    await click(buttonNamed(container, 'Record a payout to Orla Finch'));
    const amount = byLabel(container, 'Amount paid (USD)');
    expect(amount.value).toBe('13.60');
    expect(container.textContent).toContain('At most $13.60, what can be paid to Orla Finch now. $18.10 more is waiting for bags not yet posted or handed over.');

    await click(buttonNamed(container, 'Record the payout'));
    await waitFor(() => expect(container.textContent).toContain('More than the $13.60 payable now.'));
    const sent = fetch.mock.calls.find(([input]) => String(input).endsWith('/api/payouts'));
    expect(JSON.parse(String(sent?.[1]?.body))).toMatchObject({ sellerId: orlaId, amountMinor: 1360 });
  });
});
