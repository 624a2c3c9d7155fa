// @vitest-environment happy-dom
import type { OrderView, RefundEffectView } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { makeOrderView } from '../../../testing/orders.ts';
import { buttonNamed, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { OrderActions } from './order-actions.tsx';

afterEach(() => cleanup());

/** A posted order of $19.30 the treasurer may refund; the seller's credit on it is $18.10. */
const refundable = (refundEffect: RefundEffectView | null): OrderView =>
  makeOrderView({
    state: 'posted',
    viewerIs: 'officer',
    seller: { id: 's-1', name: 'Orla Vance', email: 'orla@larkhollow.example' },
    paidAt: '2026-11-02T10:05:00.000Z',
    postedAt: '2026-11-03T09:00:00.000Z',
    guildFeeMinor: 120,
    sellerCreditMinor: 1810,
    refundEffect,
    abilities: { pay: false, markPosted: false, markReceived: false, cancel: false, refund: true, reportProblem: false, viewAddress: false },
  });

/** Opens the refund dialog and gives its text. */
async function refundDialogText(order: OrderView): Promise<string> {
  const { container } = await render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <OrderActions order={order} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  await click(buttonNamed(container, 'Refund $19.30'));
  const dialog = container.querySelector('dialog');
  expect(dialog?.open).toBe(true);
  return dialog?.textContent ?? '';
}

/** The effect of refunding the posted order above (its $18.10 credit was payable) on a seller who may be paid `payableMinor` now. */
const effectOfPosted = (payableMinor: number): RefundEffectView => ({ sellerPayableMinor: payableMinor, sellerPayableAfterMinor: payableMinor - 1810, sellerCreditMinor: 1810 });

describe('the treasurer’s refund dialog', () => {
  it('warns that a seller paid out already will owe the guild what the refund takes back', async () => {
    const text = await refundDialogText(refundable(effectOfPosted(0)));

    expect(text).toContain('Orla Vance has been paid out already');
    expect(text).toContain('After this refund they will owe the guild $18.10, which comes off their next sales.');
  });

  it('counts only the part of the credit that was paid out', async () => {
    const text = await refundDialogText(refundable(effectOfPosted(1360)));

    expect(text).toContain('they will owe the guild $4.50');
  });

  it('says what the seller owes already when a refund adds to it', async () => {
    const text = await refundDialogText(refundable(effectOfPosted(-250)));

    expect(text).toContain('Orla Vance already owes the guild $2.50');
    expect(text).toContain('they will owe the guild $20.60');
  });

  it('says nothing about owing while the guild may still pay the seller enough', async () => {
    for (const effect of [effectOfPosted(1810), null]) {
      const text = await refundDialogText(refundable(effect));

      expect(text).toContain('The bundles were already sent, so they stay rehomed.');
      expect(text).not.toMatch(/owe|paid out/);
      cleanup();
    }
  });

  it('says nothing about owing for a bag not yet sent, whose credit was waiting and never paid out', async () => {
    // The seller owes $2.50 from an earlier refund; this order's credit was never payable, so the refund leaves that as it is.
    const notSent = { ...refundable({ sellerPayableMinor: -250, sellerPayableAfterMinor: -250, sellerCreditMinor: 1810 }), state: 'confirmed' as const, postedAt: null };
    const text = await refundDialogText(notSent);

    expect(text).toContain('The bundles have not been posted, so they go back on the shelf.');
    expect(text).not.toMatch(/owe|paid out/);
  });
});

describe('marking a parcel received', () => {
  const posted = makeOrderView({
    state: 'posted',
    paidAt: '2026-11-02T10:05:00.000Z',
    postedAt: '2026-11-03T09:00:00.000Z',
    abilities: { pay: false, markPosted: false, markReceived: true, cancel: false, refund: false, reportProblem: true, viewAddress: true },
  });

  async function openActions() {
    const calls: string[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
        const path = new URL(String(input), 'http://app.test').pathname;
        if (path === '/api/session') return jsonResponse(200, makeSession(makeUser()));
        calls.push(`${init?.method ?? 'GET'} ${path}`);
        return jsonResponse(200, { order: { ...posted, state: 'received', receivedAt: '2026-11-06T16:00:00.000Z' } });
      }),
    );
    const rendered = await render(
      <QueryClientProvider client={createQueryClient()}>
        <MemoryRouter>
          <OrderActions order={posted} />
        </MemoryRouter>
      </QueryClientProvider>,
    );
    return { calls, ...rendered };
  }

  afterEach(() => vi.unstubAllGlobals());

  it('asks first, and sends nothing when the buyer says not yet', async () => {
    const { container, calls } = await openActions();

    await click(buttonNamed(container, 'Mark as received'));
    const dialog = container.querySelector('dialog');
    expect(dialog?.open).toBe(true);
    expect(dialog?.textContent).toContain('Has the parcel from Orla Vance arrived?');
    expect(dialog?.textContent).toContain('Orla Vance is e-mailed that it arrived safely, and this cannot be undone.');

    await click(buttonNamed(dialog!, 'Not yet'));
    expect(dialog?.open).toBe(false);
    expect(calls).toEqual([]);
  });

  it('marks it received once confirmed, and closes the question', async () => {
    const { container, calls } = await openActions();

    await click(buttonNamed(container, 'Mark as received'));
    const dialog = container.querySelector('dialog')!;
    await click(buttonNamed(dialog, 'Yes, mark it received'));

    await waitFor(() => expect(calls).toEqual(['POST /api/orders/o-1/received']));
    await waitFor(() => expect(dialog.open).toBe(false));
  });
});
