// @vitest-environment happy-dom
import { DEFAULT_POSTAGE_TABLE, type PostageTable } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, typeInto, waitFor } from '../../../testing/render.tsx';
import { PostageTableEditor } from './postage-table-editor.tsx';

/** A small table of invented rates: one zone for codes starting LH, two bands, two packages. */
const table: PostageTable = {
  dimensional: { divisorCubicInchesPerPound: 166, thresholdCubicInches: 1728, roundEachDimensionUp: false },
  zones: [{ code: 'local', postalPrefixes: ['LH'] }],
  bands: [
    { zone: 'local', maxGrams: 500, priceMinor: 300 },
    { zone: 'local', maxGrams: 2000, priceMinor: 600 },
  ],
  packaging: [
    { code: 'envelope', name: 'Envelope', innerMm: [240, 320, 10], tareGrams: 20, maxGrams: 500, flatPriceMinor: null },
    { code: 'box', name: 'Box', innerMm: [200, 150, 100], tareGrams: 100, maxGrams: 2000, flatPriceMinor: null },
  ],
  handlingMinor: 0,
};

function serveApi(putAnswer: (body: unknown) => Response) {
  const puts: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser()));
      if (path === '/api/guild/postage' && init?.method === 'PUT') {
        const body = JSON.parse(String(init.body)) as unknown;
        puts.push(body);
        return putAnswer(body);
      }
      if (path === '/api/guild/postage') return jsonResponse(200, { postage: table });
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return { puts };
}

async function openEditor() {
  return render(
    <QueryClientProvider client={createQueryClient()}>
      <PostageTableEditor currency="GBP" units="metric" />
    </QueryClientProvider>,
  );
}

const fieldsetNamed = (root: HTMLElement, legend: string) =>
  [...root.querySelectorAll('fieldset')].find((set) => set.querySelector(':scope > legend')?.textContent === legend);

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('the postage table editor', () => {
  it('tries a quote on the table as edited, before saving', async () => {
    serveApi(() => jsonResponse(500));
    const { container } = await openEditor();
    await waitFor(() => byLabel(container, 'Postal code'));
    await typeInto(byLabel(container, 'Postal code'), 'LH1 4QT');
    // Default weights in the box are 450 g and 300 g: 750 g needs the box (100 g tare) → 850 g → the 2 kg band, £6.00.
    await waitFor(() => expect(container.textContent).toContain('Postage: £6.00 (zone local)'));

    const secondBandPrice = fieldsetNamed(container, 'Band 2')?.querySelectorAll('input')[1] as HTMLInputElement;
    await typeInto(secondBandPrice, '6.50');
    await waitFor(() => expect(container.textContent).toContain('Postage: £6.50 (zone local)'));
  });

  it('puts an error the API names by row (bands.1.priceMinor) next to that row', async () => {
    const { puts } = serveApi(() =>
      jsonResponse(400, { error: { code: 'validation_failed', message: 'Check the marked fields.', fields: { 'bands.1.priceMinor': 'Higher than the carrier charges.' } } }),
    );
    const { container } = await openEditor();
    await click(await waitFor(() => buttonNamed(container, 'Save the postage table')));

    await waitFor(() => expect(fieldsetNamed(container, 'Band 2')?.textContent).toContain('Higher than the carrier charges.'));
    expect(fieldsetNamed(container, 'Band 1')?.textContent).not.toContain('Higher than');
    expect(container.querySelector('[role="alert"]')?.textContent).toContain('Check the marked fields.');
    expect(puts).toEqual([{ countries: [], ...table }]); // a table saved before the countries list quotes every country
  });

  it('gives each band’s zone a column of its own, wide enough for a code like “regional”, with Remove under the row', async () => {
    serveApi(() => jsonResponse(500));
    const { container } = await openEditor();
    const band = await waitFor(() => {
      const found = fieldsetNamed(container, 'Band 1');
      if (!found) throw new Error('The bands are not shown yet.');
      return found;
    });
    const zone = band.querySelector('select') as HTMLSelectElement;
    expect(zone.value).toBe('local');
    const zoneField = zone.parentElement as HTMLElement;
    const row = zoneField.parentElement as HTMLElement;
    // A wrapping row in which the zone starts at 9rem (a select showing "regional"): a narrow form wraps a field to the next line instead of squeezing it.
    expect(row.className).toContain('sm:flex-wrap');
    expect(zoneField.className).toMatch(/sm:flex-\[\d+_1_9rem\]/);
    expect(row.contains(buttonNamed(band, 'Remove band 1'))).toBe(false);
  });

  it('refuses a band in a zone that does not exist before sending anything, naming the row', async () => {
    const { puts } = serveApi(() => jsonResponse(200, { postage: DEFAULT_POSTAGE_TABLE }));
    const { container } = await openEditor();
    await waitFor(() => byLabel(container, 'Code'));
    await typeInto(byLabel(container, 'Code'), 'town');
    await click(buttonNamed(container, 'Save the postage table'));

    await waitFor(() => expect(fieldsetNamed(container, 'Band 1')?.textContent).toContain('No zone called "local".'));
    expect(puts).toEqual([]);
  });
});
