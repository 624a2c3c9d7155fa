import { describe, expect, it } from 'vitest';
import { MEMBER_ABILITIES, NO_ABILITIES } from '../testing/fixtures.ts';
import { canOpen, navFor } from './nav.ts';
import { paths } from './paths.ts';

const labels = (entries: ReturnType<typeof navFor>) => entries.map((entry) => entry.label);

describe('pages that any one of several abilities opens', () => {
  it('opens the starter programme to new quilters and to the librarians who run it, not to other members', () => {
    expect(canOpen(paths.app.starter, { ...MEMBER_ABILITIES, claimStarter: true })).toBe(true);
    expect(canOpen(paths.app.starter, { ...MEMBER_ABILITIES, runStarterProgramme: true })).toBe(true);
    expect(canOpen(paths.app.starter, MEMBER_ABILITIES)).toBe(false);
  });

  it('shows the starter programme and the librarian’s pages in the menu by the same rule', () => {
    const librarian = labels(navFor({ ...NO_ABILITIES, runStarterProgramme: true }));
    expect(librarian).toEqual(expect.arrayContaining(['Starter bundles', 'Waiting list', 'Librarian report', 'Meetings', 'Dashboard', 'Profile']));
    expect(librarian).not.toContain('Statement');
    expect(labels(navFor({ ...NO_ABILITIES, viewLedger: true }))).toContain('Statement');
    expect(labels(navFor(MEMBER_ABILITIES))).not.toContain('Starter bundles');
  });
});
