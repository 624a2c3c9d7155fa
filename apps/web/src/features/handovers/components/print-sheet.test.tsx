// @vitest-environment happy-dom
import type { MeetingView } from '@scrap-relay/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { makeHandover } from '../../../testing/handovers.ts';
import { cleanup, render } from '../../../testing/render.tsx';
import { PrintSheet } from './print-sheet.tsx';

afterEach(() => cleanup());

const meeting: MeetingView = { id: 'mt-1', startsAt: '2026-12-10T19:00:00.000Z', place: 'Larkhollow Chapel Hall', notes: '', abilities: { edit: false } };

describe('the printed handover sheet', () => {
  it('names the collector on every row of “Who collects what”, also a second handover for the same person', async () => {
    const { container } = await render(
      <PrintSheet
        meeting={meeting}
        timeZone="Europe/London"
        items={[
          makeHandover('Wren Hollis', 'Bea Marrow', { reference: 'SR-0001' }),
          makeHandover('Alder Finch', 'Bea Marrow', { reference: 'SR-0002' }),
          makeHandover('Wren Hollis', 'Cy Tolland', { reference: 'SR-0003' }),
        ]}
      />,
    );

    const collectTable = [...container.querySelectorAll('section')].find((section) => section.textContent?.includes('Who collects what'));
    const rows = [...(collectTable?.querySelectorAll('tbody tr') ?? [])].map((row) => [...row.querySelectorAll('td')].slice(1, 4).map((cell) => cell.textContent));
    expect(rows).toEqual([
      ['Bea Marrow', 'SR-0002', 'Alder Finch'],
      ['Bea Marrow', 'SR-0001', 'Wren Hollis'],
      ['Cy Tolland', 'SR-0003', 'Wren Hollis'],
    ]);
  });
});
