// @vitest-environment happy-dom
import type { OrderView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';
import { createQueryClient } from '../../../lib/react-query.ts';
import { makeSession, makeUser, testGuild } from '../../../testing/fixtures.ts';
import { makeOrderView } from '../../../testing/orders.ts';
import { cleanup, render } from '../../../testing/render.tsx';
import { OrderDetails } from './order-details.tsx';

afterEach(() => cleanup());

/** The order page's body, for a guild in Los Angeles (the test's device clock may be in any zone). */
async function orderPage(order: OrderView) {
  const client = createQueryClient();
  client.setQueryData(SESSION_CACHE_KEY, { ...makeSession(makeUser()), guild: { ...testGuild, timeZone: 'America/Los_Angeles' } });
  return render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <OrderDetails order={order} units="imperial" payment={null} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const panel = (container: HTMLElement, title: string) =>
  [...container.querySelectorAll('section')].find((section) => section.querySelector('h2')?.textContent === title);

/** A free bundle to collect at a meeting, confirmed at once (its confirmation stamped 3 ms before the order row). */
const freeMeetingOrder = makeOrderView({
  state: 'confirmed',
  fulfilment: 'meeting',
  subtotalMinor: 0,
  postageMinor: 0,
  chargeMinor: 0,
  items: [{ bundleId: 'x', title: 'Selvages for a selvage project', quantity: 1, unitPriceMinor: 0, weightGrams: 255, thumbUrl: null }],
  meeting: { id: 'm-1', startsAt: '2026-12-12T03:00:00.000Z', place: 'Ferncombe Village Hall', notes: '', abilities: { edit: false } },
  paidAt: '2026-12-02T18:24:09.118Z',
  createdAt: '2026-12-02T18:24:09.121Z',
});

describe('the order page', () => {
  it('gives the meeting and the history in the guild’s time zone, the order placed first', async () => {
    const { container } = await orderPage(freeMeetingOrder);
    // 03:00 UTC on 12 December is 7 PM on the 11th in Los Angeles (UTC−8 in winter, IANA tz database).
    expect(panel(container, 'Meeting handover')?.textContent).toContain('Friday, December 11, 2026 at 7:00 PM PST');
    const history = [...(panel(container, 'History')?.querySelectorAll('li') ?? [])].map((item) => item.textContent);
    expect(history).toEqual(['Order placedDecember 2, 2026 at 10:24 AM PST', 'ConfirmedDecember 2, 2026 at 10:24 AM PSTNothing to pay']);
  });

  it('says nothing about card payments when there is nothing to pay', async () => {
    const { container } = await orderPage(freeMeetingOrder);
    expect(panel(container, 'Money')?.textContent).not.toContain('merchant');
  });

  it('keeps the merchant note for an order that is charged, and drops it once cancelled unpaid', async () => {
    const paid = await orderPage(makeOrderView({ state: 'confirmed', paidAt: '2026-11-02T10:05:00.000Z' }));
    expect(panel(paid.container, 'Money')?.textContent).toContain('The guild is the merchant for card payments.');
    cleanup();
    const awaiting = await orderPage(makeOrderView());
    expect(panel(awaiting.container, 'Money')?.textContent).toContain('The guild is the merchant for card payments.');
    cleanup();
    const cancelled = await orderPage(makeOrderView({ state: 'cancelled', cancelledAt: '2026-11-02T11:00:00.000Z' }));
    expect(panel(cancelled.container, 'Money')?.textContent).not.toContain('merchant');
  });

  it('does not say a parcel was posted before it was', async () => {
    const address = { name: 'Maud Tilling', line1: '3 Loom Street', line2: '', town: 'Ferncombe', region: 'OR', postalCode: '97451', country: 'US' };
    const waiting = await orderPage(makeOrderView({ address }));
    expect(panel(waiting.container, 'By post')?.textContent).toContain('Will be posted to you at');
    expect(panel(waiting.container, 'By post')?.textContent).not.toContain('Posted to you');
    cleanup();

    const cancelled = await orderPage(makeOrderView({ address, state: 'cancelled', cancelledAt: '2026-11-02T11:00:00.000Z' }));
    expect(panel(cancelled.container, 'By post')?.textContent).toContain('Was to be posted to you at');
  });
});
