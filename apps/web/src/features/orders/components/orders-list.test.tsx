// @vitest-environment happy-dom
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse } from '../../../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import type { OrderSide } from '../api/get-orders.ts';
import { OrdersList } from './orders-list.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** A member with no orders on either side. */
async function openEmptyList(side: OrderSide, claimsStarter: boolean) {
  vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(200, { items: [] })));
  const rendered = await render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <OrdersList side={side} claimsStarter={claimsStarter} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  await waitFor(() => expect(rendered.container.textContent).toContain('No orders yet'));
  return rendered;
}

const linkTargets = (root: HTMLElement) => Object.fromEntries([...root.querySelectorAll('a')].map((a) => [a.textContent, a.getAttribute('href')]));

describe('an empty orders list', () => {
  it('tells a new quilter that starter bundles they claim are not orders, and where they are', async () => {
    const { container } = await openEmptyList('buyer', true);

    expect(container.textContent).toContain('No orders yet: you have not bought or asked for a bundle from the shelf.');
    expect(container.textContent).toContain('Starter bundles you claim are not orders');
    expect(container.textContent).not.toContain('gift');
    expect(linkTargets(container)).toEqual({ 'Browse the shelf': '/shelf', 'Your starter bundles': '/starter' });
  });

  it('points any other member to the shelf, without the starter programme', async () => {
    const { container } = await openEmptyList('buyer', false);

    expect(container.textContent).not.toContain('Starter bundles');
    expect(linkTargets(container)).toEqual({ 'Browse the shelf': '/shelf' });
  });

  it('says nobody has asked for the seller’s bundles yet, with the shelf link too', async () => {
    const { container } = await openEmptyList('seller', true);

    expect(container.textContent).toContain('No orders yet: nobody has bought or asked for one of your bundles.');
    expect(linkTargets(container)).toEqual({ 'Browse the shelf': '/shelf' });
  });
});
