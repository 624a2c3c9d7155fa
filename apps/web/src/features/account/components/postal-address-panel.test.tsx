// @vitest-environment happy-dom
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse } from '../../../testing/fixtures.ts';
import { cleanup, render, waitFor } from '../../../testing/render.tsx';
import { PostalAddressPanel } from './postal-address-panel.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

async function panelWith(address: unknown) {
  vi.stubGlobal('fetch', vi.fn(async () => jsonResponse(200, { address })));
  return render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <PostalAddressPanel />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const link = (container: HTMLElement) => container.querySelector('a');

describe('the postal address on the member’s own pages', () => {
  it('leads a member with no address to add one', async () => {
    const { container } = await panelWith(null);
    await waitFor(() => expect(container.textContent).toContain('You have not saved an address yet.'));
    expect(link(container)?.textContent).toBe('Add your postal address');
    expect(link(container)?.getAttribute('href')).toBe('/account/address');
  });

  it('shows the saved address, with the country by name, and the way to change it', async () => {
    const { container } = await panelWith({ name: 'Maud Tilling', line1: '3 Loom Street', line2: '', town: 'Ferncombe', region: 'OR', postalCode: '97451', country: 'US' });
    await waitFor(() => expect(container.querySelector('address')?.textContent).toBe('Maud Tilling3 Loom StreetFerncombe, OR97451United States'));
    expect(link(container)?.textContent).toBe('Change your postal address');
  });
});
