// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render } from '../testing/render.tsx';
import { ColourSwatch, colourWords } from './colour-swatch.tsx';

afterEach(cleanup);

describe('a colour swatch', () => {
  it('names the colour in words, never by its code', async () => {
    const { container } = await render(<ColourSwatch hex="#d78e76" />);
    const swatch = container.querySelector('[role="img"]')!;
    // #d78e76: hue about 15° (warm), CIE L* about 66 (medium, just under the light class from 66⅔) — the guild's rules in colour.ts.
    expect(swatch.getAttribute('aria-label')).toBe('average colour of the photos: medium, warm');
    expect(container.textContent).not.toContain('#');
  });

  it('says what the colour is of, and reads greys and near-whites by the same rules', async () => {
    const { container } = await render(<ColourSwatch hex="#cd5d33" of="average colour of the photo" />);
    expect(container.querySelector('[role="img"]')!.getAttribute('aria-label')).toBe('average colour of the photo: medium, warm');
    expect(colourWords('#777777')).toBe('medium, neutral');
    expect(colourWords('#f4f4f2')).toBe('light, black and white');
    expect(colourWords('#1d2547')).toBe('dark, cool');
    expect(colourWords('not a colour')).toBeNull();
  });
});
