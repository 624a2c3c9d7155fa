// @vitest-environment happy-dom
import type { SellerBalanceView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import { SellerBalancesView } from './seller-balances-view.tsx';

const balance = (name: string, creditedMinor: number, paidOutMinor: number): SellerBalanceView => ({
  sellerId: `id-${name}`,
  name,
  creditedMinor,
  paidOutMinor,
  balanceMinor: creditedMinor - paidOutMinor,
  currency: 'USD',
});

function serveBalances(items: SellerBalanceView[]) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser({ roles: ['member', 'treasurer'] })));
      if (path === '/api/seller-balances') return jsonResponse(200, { items });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('seller balances', () => {
  it('shows a seller refunded after a payout as owing the guild, and totals that agree with the month statement', async () => {
    // Orla is owed $29.10. Piet was paid out his $17.30, then a refund took $4.50 of his credits back: he owes $4.50.
    serveBalances([balance('Orla Finch', 2910, 0), balance('Piet Marsh', 1280, 1730)]);
    const { container } = await render(
      <QueryClientProvider client={createQueryClient()}>
        <SellerBalancesView />
      </QueryClientProvider>,
    );
    await waitFor(() => expect(container.textContent).toContain('The guild owes sellers $29.10 in all.'));
    expect(container.textContent).toContain('Piet Marsh owes the guild $4.50');
    expect(container.textContent).toContain('Owes the guild $4.50, from a refund after a payout');
    expect(container.textContent).toContain('total owed to sellers, which nets it off, is $24.60');
    expect(container.textContent).not.toContain('Nothing owed');
  });
});
