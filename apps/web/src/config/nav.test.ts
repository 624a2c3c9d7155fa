import { describe, expect, it } from 'vitest';
import { ADMIN_ABILITIES, MEMBER_ABILITIES, NO_ABILITIES } from '../testing/fixtures.ts';
import { canOpen, NAV_ENTRIES, navFor } from './nav.ts';
import { isSafeRedirect, paths } from './paths.ts';

const labels = (entries: ReturnType<typeof navFor>) => entries.map((entry) => entry.label);

describe('navigation from abilities', () => {
  it('gives a plain member the pages everyone may open, and no officer pages', () => {
    expect(labels(navFor(MEMBER_ABILITIES))).toEqual(['Home', 'Account']);
  });

  it('adds Members and Guild settings for an admin, in menu order', () => {
    expect(labels(navFor(ADMIN_ABILITIES))).toEqual(['Home', 'Members', 'Guild settings', 'Account']);
  });

  it('follows each ability separately, not a role', () => {
    expect(labels(navFor({ ...NO_ABILITIES, manageSettings: true }))).toEqual(['Home', 'Guild settings', 'Account']);
    expect(labels(navFor({ ...NO_ABILITIES, manageMembers: true }))).toEqual(['Home', 'Members', 'Account']);
  });

  it('uses the same rule for the route guard as for the menu', () => {
    for (const entry of NAV_ENTRIES) {
      expect(canOpen(entry.page, MEMBER_ABILITIES)).toBe(navFor(MEMBER_ABILITIES).includes(entry));
    }
    expect(canOpen(paths.app.members, MEMBER_ABILITIES)).toBe(false);
  });
});

describe('return address after sign-in', () => {
  it('accepts paths on this site only', () => {
    expect(isSafeRedirect('/admin/members?page=2')).toBe(true);
    expect(isSafeRedirect('//elsewhere.example/x')).toBe(false);
    expect(isSafeRedirect('/\\elsewhere.example')).toBe(false);
    expect(isSafeRedirect('https://elsewhere.example')).toBe(false);
    expect(isSafeRedirect(null)).toBe(false);
  });

  it('carries it in the sign-in link, leaving out the home page', () => {
    expect(paths.auth.signIn.getHref('/admin/members')).toBe('/sign-in?redirectTo=%2Fadmin%2Fmembers');
    expect(paths.auth.signIn.getHref('/')).toBe('/sign-in');
    expect(paths.auth.signIn.getHref('//elsewhere.example')).toBe('/sign-in');
  });
});
