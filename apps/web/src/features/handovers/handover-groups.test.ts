import { describe, expect, it } from 'vitest';
import { makeHandover } from '../../testing/handovers.ts';
import { markedLocally } from './api/mark-handover.ts';
import { filterHandovers, groupHandovers, sheetProgress } from './handover-groups.ts';

describe('grouping the handover sheet', () => {
  const sheet = [
    makeHandover('Wren', 'Bea'),
    makeHandover('Alder', 'Cy'),
    makeHandover('Wren', 'Abe', { done: true }),
    makeHandover('', 'Dot', { kind: 'starter' }),
    makeHandover('Alder', 'amos'),
  ];

  it('groups by who brings, people and their collectors in name order', () => {
    const groups = groupHandovers(sheet, 'giver');
    expect(groups.map((g) => g.person.name)).toEqual(['Alder', 'Guild stash', 'Wren']);
    // Names compare without regard to capitals, as people read them.
    expect(groups[0]!.handovers.map((h) => h.collector.name)).toEqual(['amos', 'Cy']);
    expect(groups[2]!.handovers.map((h) => h.collector.name)).toEqual(['Abe', 'Bea']);
  });

  it('groups by who collects, keeping every handover exactly once', () => {
    const groups = groupHandovers(sheet, 'collector');
    expect(groups.map((g) => g.person.name)).toEqual(['Abe', 'amos', 'Bea', 'Cy', 'Dot']);
    expect(groups[0]!.handovers.map((h) => h.giver.name)).toEqual(['Wren']);
    expect(groups.flatMap((g) => g.handovers)).toHaveLength(sheet.length);
  });

  it('counts what is done and what is still open', () => {
    expect(sheetProgress(sheet)).toEqual({ total: 5, done: 1, open: 4 });
    expect(sheetProgress([])).toEqual({ total: 0, done: 0, open: 0 });
  });

  it('finds handovers at the door by any word of a name, reference or title', () => {
    expect(filterHandovers(sheet, 'wren').map((h) => h.collector.name)).toEqual(['Bea', 'Abe']);
    expect(filterHandovers(sheet, 'amos alder')).toEqual([sheet[4]]);
    expect(filterHandovers(sheet, '  ')).toHaveLength(sheet.length);
    expect(filterHandovers(sheet, sheet[1]!.reference.toLowerCase())).toEqual([sheet[1]]);
  });
});

describe('a tick shown before the API answers', () => {
  it('records the viewer and the time, and offers undo instead of the tick', () => {
    const now = new Date('2026-12-10T19:05:00Z');
    const ticked = markedLocally(makeHandover('Wren', 'Bea'), true, 'Lena Marsh', now);
    expect(ticked).toMatchObject({ done: true, doneBy: 'Lena Marsh', doneAt: '2026-12-10T19:05:00.000Z', abilities: { markDone: false, undo: true, cancel: false } });
    expect(markedLocally(ticked, false, 'Lena Marsh', now)).toMatchObject({ done: false, doneBy: null, doneAt: null, abilities: { markDone: true, undo: false } });
  });
});
