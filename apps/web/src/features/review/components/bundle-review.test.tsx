// @vitest-environment happy-dom
import { estimateYield } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { makeBundleView } from '../../../testing/fixtures.ts';
import { cleanup, render } from '../../../testing/render.tsx';
import { yieldFacts } from '../../../utils/yield-text.ts';
import { BundleReview } from './bundle-review.tsx';

afterEach(cleanup);

const photo = (id: string, averageHex: string) => ({
  id,
  url: `/uploads/photos/${id}-1600.webp`,
  mediumUrl: `/uploads/photos/${id}-800.webp`,
  thumbUrl: `/uploads/photos/${id}-400.webp`,
  width: 1600,
  height: 1200,
  averageHex,
});

describe('the librarian’s view of a bundle', () => {
  it('shows the yield in the bundle page’s words and the photos’ colours as swatches, never as codes', async () => {
    // 2 kg of quilting cotton: a yield with counts past a thousand.
    const estimate = estimateYield({ grams: 2000, fibre: 'quilting_cotton' });
    const bundle = makeBundleView({ yield: estimate, photos: [photo('p-1', '#cd5d33'), photo('p-2', '#1d2547')] });
    const { container } = await render(
      <QueryClientProvider client={createQueryClient()}>
        <BundleReview bundle={bundle} units="imperial" onDecided={() => undefined} />
      </QueryClientProvider>,
    );
    const text = container.textContent ?? '';
    for (const { label, value } of yieldFacts(estimate, 'imperial')) expect(text).toContain(`${label}${value}`);
    expect(text).toMatch(/\d,\d{3}/);
    expect(text).not.toContain(String(estimate.twoAndHalfInchSquares));
    expect(text).not.toContain(`${estimate.linearYards} yd`);

    expect(text).not.toMatch(/#[0-9a-f]{6}/i);
    const swatches = [...container.querySelectorAll('figcaption [role="img"]')].map((s) => s.getAttribute('aria-label'));
    expect(swatches).toEqual(['average colour of the photo: medium, warm', 'average colour of the photo: dark, cool']);
  });
});
