import type { HandoverView } from '@scrap-relay/shared';

export interface PersonGroup {
  person: { id: string; name: string };
  handovers: HandoverView[];
}

/**
 * Handovers grouped by one side (who brings, or who collects), people in name order
 * and each person's handovers by the other person's name, then reference — the order
 * a librarian reads down a printed list.
 */
export function groupHandovers(items: readonly HandoverView[], by: 'giver' | 'collector'): PersonGroup[] {
  const other = by === 'giver' ? 'collector' : 'giver';
  const groups = new Map<string, PersonGroup>();
  for (const handover of items) {
    const person = handover[by];
    // Starter bundles from the guild's own stash have no member as giver: group them under their name.
    const key = person.id || `name:${person.name}`;
    const group = groups.get(key) ?? { person, handovers: [] };
    group.handovers.push(handover);
    groups.set(key, group);
  }
  const byName = (a: string, b: string) => a.localeCompare(b, 'en', { sensitivity: 'base' });
  for (const group of groups.values()) {
    group.handovers.sort((a, b) => byName(a[other].name, b[other].name) || a.reference.localeCompare(b.reference));
  }
  return [...groups.values()].sort((a, b) => byName(a.person.name, b.person.name) || a.person.id.localeCompare(b.person.id));
}

export interface SheetProgress {
  total: number;
  done: number;
  open: number;
}

export function sheetProgress(items: readonly HandoverView[]): SheetProgress {
  const done = items.filter((h) => h.done).length;
  return { total: items.length, done, open: items.length - done };
}

/** Lower-case text a handover is found by in the door search: both names, the reference and the bundle titles. */
export const handoverSearchText = (h: HandoverView): string =>
  [h.giver.name, h.collector.name, h.reference, ...h.items.map((i) => i.title)].join(' ').toLowerCase();

export function filterHandovers(items: readonly HandoverView[], query: string): HandoverView[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...items];
  return items.filter((h) => {
    const text = handoverSearchText(h);
    return words.every((word) => text.includes(word));
  });
}
