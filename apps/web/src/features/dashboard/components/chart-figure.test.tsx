// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { buttonNamed, cleanup, click, render } from '../../../testing/render.tsx';
import { ChartFigure, ChartTable } from './chart-figure.tsx';

afterEach(cleanup);

const figure = () => (
  <ChartFigure
    title="On the shelf by colour value"
    note="Bundles on the shelf now."
    summary="Light: 4; Dark: 2."
    chart={<svg data-testid="chart" />}
    table={<ChartTable caption="Bundles by colour value" columns={['Colour value', 'Bundles']} rows={[{ key: 'light', cells: ['Light', 4] }, { key: 'dark', cells: ['Dark', 2] }]} />}
  />
);

describe('a chart and its text alternative', () => {
  it('names the figure by its caption and speaks the summary in place of the picture', async () => {
    const { container } = await render(figure());
    const element = container.querySelector('figure')!;
    const caption = container.querySelector('figcaption')!;
    expect(element.getAttribute('aria-labelledby')).toBe(caption.id);
    expect(caption.textContent).toContain('On the shelf by colour value');
    expect(container.querySelector('[role="img"]')?.getAttribute('aria-label')).toBe('On the shelf by colour value. Light: 4; Dark: 2.');
    expect(container.querySelector('table')).toBeNull();
  });

  it('swaps the chart for a table of the same numbers and back', async () => {
    const { container } = await render(figure());
    await click(buttonNamed(container, 'Show as table'));
    const rows = [...container.querySelectorAll('tbody tr')].map((row) => [...row.children].map((cell) => cell.textContent));
    expect(rows).toEqual([
      ['Light', '4'],
      ['Dark', '2'],
    ]);
    expect(container.querySelector('[role="img"]')).toBeNull();
    expect(buttonNamed(container, 'Show as chart').getAttribute('aria-pressed')).toBe('true');
    await click(buttonNamed(container, 'Show as chart'));
    expect(container.querySelector('table')).toBeNull();
    expect(container.querySelector('[role="img"]')).not.toBeNull();
  });
});
