import type { HandoverView } from '@scrap-relay/shared';

let counter = 0;

/**
 * An order handed over at a meeting, from `giver` to `collector` (invented people);
 * each call gets the next reference. An empty giver is the guild's own stash, as for a starter bundle.
 */
export function makeHandover(giver: string, collector: string, overrides: Partial<HandoverView> = {}): HandoverView {
  counter += 1;
  return {
    id: `h-${counter}`,
    kind: 'order',
    reference: `SR-${String(counter).padStart(4, '0')}`,
    giver: { id: giver ? `m-${giver.toLowerCase()}` : '', name: giver || 'Guild stash' },
    collector: { id: `m-${collector}`, name: collector },
    items: [{ title: `Bundle ${counter}`, quantity: 1, thumbUrl: null }],
    done: false,
    doneAt: null,
    doneBy: null,
    checkOffUrl: `http://app.test/handovers/h-${counter}`,
    qrSvg: '<svg/>',
    abilities: { markDone: true, undo: false, cancel: true },
    undoNote: null,
    ...overrides,
  };
}
