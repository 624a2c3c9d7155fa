// @vitest-environment happy-dom
import type { OrderDisputeView, OrderView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';
import { makeSession, makeUser, testGuild } from '../../../testing/fixtures.ts';
import { makeOrderView } from '../../../testing/orders.ts';
import { cleanup, render } from '../../../testing/render.tsx';
import { DisputePanel } from './dispute-panel.tsx';

afterEach(cleanup);

const opened = { stage: 'open', openedAt: '2026-11-20T17:00:00.000Z', closedAt: null } as const;
const forTreasurer: OrderDisputeView = { ...opened, status: 'needs_response', amountMinor: 1930, reason: 'fraudulent', evidenceDueBy: '2026-11-27T23:59:59.000Z', feeMinor: 1500 };
const forSeller: OrderDisputeView = { ...opened, status: null, amountMinor: null, reason: null, evidenceDueBy: null, feeMinor: null };

async function renderPanel(order: OrderView, dispute: OrderDisputeView) {
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser()), guild: testGuild });
  const { container } = await render(
    <QueryClientProvider client={client}>
      <DisputePanel order={order} dispute={dispute} />
    </QueryClientProvider>,
  );
  return container.textContent ?? '';
}

describe('the dispute on an order', () => {
  it('tells the treasurer the dispute fee is in the ledger while the order’s own money waits for the bank', async () => {
    const text = await renderPanel(makeOrderView({ state: 'posted', viewerIs: 'officer', dispute: forTreasurer }), forTreasurer);
    expect(text).toContain('The ledger holds the card service’s dispute fee as the guild’s cost');
    expect(text).toContain('cannot be refunded or cancelled');
    expect(text).toContain('Card service’s dispute fee$15.00, the guild’s cost');
  });

  it('asks the seller to keep proof of posting, and to keep bundles not yet sent until the treasurer says', async () => {
    const posted = await renderPanel(makeOrderView({ state: 'posted', viewerIs: 'seller', dispute: forSeller }), forSeller);
    expect(posted).toContain('Keep your proof of posting');
    expect(posted).not.toContain('have not gone out yet');
    cleanup();
    const waiting = await renderPanel(makeOrderView({ state: 'confirmed', viewerIs: 'seller', dispute: forSeller }), forSeller);
    expect(waiting).toContain('keep them until the treasurer tells you whether to send them');
  });

  it('tells the treasurer the seller keeps bundles not yet sent, and names a dispute fee only when one was charged', async () => {
    const noFee = { ...forTreasurer, feeMinor: 0 };
    const text = await renderPanel(makeOrderView({ state: 'confirmed', viewerIs: 'officer', dispute: noFee }), noFee);
    expect(text).toContain('has been asked to keep them until you say whether to send them');
    expect(text).not.toContain('The ledger holds the card service’s dispute fee');
    expect(text).toContain('Card service’s dispute feeNone');
  });

  it('does not ask the seller for proof of posting before the bundles went out', async () => {
    const waiting = await renderPanel(makeOrderView({ state: 'confirmed', viewerIs: 'seller', dispute: forSeller }), forSeller);
    expect(waiting).not.toContain('proof of posting');
  });
});
