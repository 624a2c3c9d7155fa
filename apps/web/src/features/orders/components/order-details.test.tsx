// @vitest-environment happy-dom
import type { OrderDisputeView, OrderView } from '@scrap-relay/shared';
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

/** A posted order of $19.30 whose buyer's bank opened a dispute on 20 November, evidence due by the end of 27 November (UTC). */
const openForTreasurer: OrderDisputeView = {
  stage: 'open',
  status: 'needs_response',
  amountMinor: 1930,
  reason: 'product_not_received',
  openedAt: '2026-11-20T17:00:00.000Z',
  evidenceDueBy: '2026-11-27T23:59:59.000Z',
  feeMinor: 1500,
  closedAt: null,
};

const posted = (viewerIs: OrderView['viewerIs'], dispute: OrderDisputeView) =>
  makeOrderView({
    state: 'posted',
    viewerIs,
    paidAt: '2026-11-02T10:05:00.000Z',
    postedAt: '2026-11-03T09:00:00.000Z',
    trackingNumber: 'FERN-2231',
    guildFeeMinor: 120,
    sellerCreditMinor: 1810,
    dispute,
  });

const disputePanel = (container: HTMLElement) => panel(container, 'Card payment dispute');

describe('a disputed card payment on the order page', () => {
  it('gives the treasurer the amount, the reason, the deadline in the guild’s time and where to answer', async () => {
    const { container } = await orderPage(posted('officer', openForTreasurer));
    const text = disputePanel(container)?.textContent ?? '';
    expect(text).toContain('Waiting for the guild’s answer');
    expect(text).toContain('$19.30');
    expect(text).toContain('The buyer says the order never arrived');
    // 23:59:59 UTC on 27 November is 3:59 PM the same day in Los Angeles (UTC−8 in winter, IANA tz database).
    expect(text).toContain('November 27, 2026 at 3:59 PM PST');
    expect(text).toContain('the card service’s own dashboard');
    expect(text).toContain('the tracking number FERN-2231');
    expect(text).toContain('local law');
    const history = [...container.querySelectorAll('li')].map((item) => item.textContent ?? '');
    expect(history.some((line) => line.startsWith('The buyer’s bank disputed the card payment') && line.includes('$19.30: The buyer says the order never arrived'))).toBe(true);
  });

  it('tells the treasurer a lost dispute was booked, and drops the deadline', async () => {
    const lost: OrderDisputeView = { ...openForTreasurer, stage: 'lost', status: 'lost', closedAt: '2026-12-10T18:00:00.000Z' };
    const { container } = await orderPage(posted('officer', lost));
    const text = disputePanel(container)?.textContent ?? '';
    expect(text).toContain('Decided for the buyer: the money went back');
    expect(text).toContain('seller’s credit and the guild’s fee for this order taken back');
    expect(text).not.toContain('Evidence due by');
    // 18:00 UTC on 10 December is 10 AM in Los Angeles (UTC−8 in winter, IANA tz database).
    expect(text).toContain('December 10, 2026 at 10:00 AM PST');
  });

  it('gives the seller a plain line and none of the bank’s details', async () => {
    const forSeller: OrderDisputeView = { stage: 'open', status: null, amountMinor: null, reason: null, evidenceDueBy: null, feeMinor: null, openedAt: openForTreasurer.openedAt, closedAt: null };
    const { container } = await orderPage(posted('seller', forSeller));
    expect(disputePanel(container)).toBeUndefined();
    const note = container.querySelector('[class*="border-l-8"]')?.textContent ?? '';
    expect(note).toContain('The buyer’s bank is looking into the card payment for this order');
    expect(note).toContain('proof of posting');
    expect(container.textContent).not.toContain('never arrived');
  });

  it('asks the seller to check with the treasurer before sending bundles whose payment the bank took back', async () => {
    const lost: OrderDisputeView = { stage: 'lost', status: null, amountMinor: null, reason: null, evidenceDueBy: null, feeMinor: null, openedAt: openForTreasurer.openedAt, closedAt: '2026-12-10T18:00:00.000Z' };
    const unsent = await orderPage({ ...posted('seller', lost), state: 'confirmed', postedAt: null, trackingNumber: null });
    expect(unsent.container.textContent).toContain('The buyer’s bank took the card payment back');
    expect(unsent.container.textContent).toContain('please do not send them until the treasurer tells you what to do');
    cleanup();
    const sent = await orderPage(posted('seller', lost));
    expect(sent.container.textContent).toContain('Your credit for this order was taken back with it.');
    expect(sent.container.textContent).not.toContain('before you send them');
  });

  it('shows nothing of a dispute on an order without one', async () => {
    const { container } = await orderPage(makeOrderView({ state: 'posted', viewerIs: 'officer', paidAt: '2026-11-02T10:05:00.000Z' }));
    expect(disputePanel(container)).toBeUndefined();
    expect(container.textContent).not.toContain('bank');
  });
});

describe('a problem the buyer reported, on the order page', () => {
  const reported = (viewerIs: OrderView['viewerIs'], message: string | null) =>
    makeOrderView({
      state: 'posted',
      viewerIs,
      paidAt: '2026-11-02T10:05:00.000Z',
      postedAt: '2026-11-03T09:00:00.000Z',
      problems: [{ id: 'p-1', message, createdAt: '2026-11-06T17:00:00.000Z', resolvedAt: null }],
    });

  it('shows the treasurer what the buyer wrote', async () => {
    const { container } = await orderPage(reported('officer', 'The bag arrived soaked.'));
    expect(container.textContent).toContain('The buyer reported a problem');
    expect(container.textContent).toContain('“The bag arrived soaked.”');
  });

  it('tells the seller a problem was reported and who is looking into it, without the buyer’s words', async () => {
    const { container } = await orderPage(reported('seller', null));
    expect(container.textContent).toContain('The buyer reported a problem with this order');
    expect(container.textContent).toContain('The guild’s treasurer is looking into it');
    const history = [...container.querySelectorAll('li')].map((item) => item.textContent ?? '');
    expect(history.some((line) => line.startsWith('Problem reported') && line.includes('The buyer wrote to the guild’s treasurer.'))).toBe(true);
  });
});
