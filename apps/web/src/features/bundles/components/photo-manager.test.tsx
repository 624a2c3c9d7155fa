// @vitest-environment happy-dom
import { QueryClientProvider } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { cleanup, render } from '../../../testing/render.tsx';
import { PhotoManager } from './photo-manager.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The photo step on a screen whose main pointer is a finger (`coarse`) or a mouse. */
async function openPhotoStep(pointer: 'coarse' | 'fine') {
  vi.stubGlobal('matchMedia', (query: string) => ({ matches: query === '(pointer: coarse)' && pointer === 'coarse', media: query }));
  const { container } = await render(
    <QueryClientProvider client={createQueryClient()}>
      <PhotoManager bundle={null} onAddFiles={() => undefined} />
    </QueryClientProvider>,
  );
  return container;
}

const buttons = (root: HTMLElement) => [...root.querySelectorAll('button')].map((button) => button.textContent);

describe('adding photos', () => {
  it('asks a touch screen to choose or take photos, never to drag them', async () => {
    const container = await openPhotoStep('coarse');

    expect(container.textContent).toContain('Choose photos, or take them now with the camera.');
    expect(container.textContent).not.toMatch(/drag/i);
    expect(buttons(container)).toEqual(['Choose photos', 'Take a photo']);
  });

  it('offers dragging with a mouse on a wide screen only, and choosing photos on a narrow one', async () => {
    const container = await openPhotoStep('fine');

    const wide = [...container.querySelectorAll('span')].find((span) => span.textContent === 'Drag photos here, or');
    const narrow = [...container.querySelectorAll('span')].find((span) => span.textContent === 'Choose photos of the bundle.');
    expect(wide?.className).toBe('hidden sm:inline');
    expect(narrow?.className).toBe('sm:hidden');
    expect(buttons(container)).toEqual(['Choose photos']);
  });
});
