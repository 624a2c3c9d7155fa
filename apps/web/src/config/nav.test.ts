import { describe, expect, it } from 'vitest';
import { ADMIN_ABILITIES, MEMBER_ABILITIES, NO_ABILITIES } from '../testing/fixtures.ts';
import { canOpen, currentNavEntry, NAV_ENTRIES, NAV_SECTIONS, navFor, navGroups, type NavEntry } from './nav.ts';
import { isSafeRedirect, paths } from './paths.ts';

const labels = (entries: readonly NavEntry[]) => entries.map((entry) => entry.label);
const grouped = (entries: readonly NavEntry[]) => navGroups(entries).map((group) => [group.label, labels(group.entries)] as const);

/** Every member's exchange pages and their own settings: what any verified member sees. */
const EXCHANGE = ['Home', 'Shelf', 'Wishes', 'List a bundle', 'My bundles', 'Basket', 'Orders', 'Meetings', 'Dashboard'];
const YOU = ['Profile', 'Account'];

describe('navigation from abilities', () => {
  it('gives a plain member the exchange and their own pages, and no guild office', () => {
    expect(grouped(navFor(MEMBER_ABILITIES))).toEqual([
      ['Exchange', EXCHANGE],
      ['You', YOU],
    ]);
  });

  it('adds the admin’s pages under Guild office, in menu order', () => {
    expect(grouped(navFor(ADMIN_ABILITIES))).toEqual([
      ['Exchange', EXCHANGE],
      ['Guild office', ['Members', 'Guild settings', 'Postage table']],
      ['You', YOU],
    ]);
  });

  it('gives a librarian the review queue, the starter programme and the member list, not the ledger', () => {
    const librarian = { ...MEMBER_ABILITIES, reviewBundles: true, runStarterProgramme: true, manageMembers: true };
    expect(grouped(navFor(librarian))).toEqual([
      ['Exchange', [...EXCHANGE.slice(0, 7), 'Starter bundles', ...EXCHANGE.slice(7)]],
      ['Guild office', ['Review queue', 'Waiting list', 'Librarian report', 'Members']],
      ['You', YOU],
    ]);
  });

  it('gives a treasurer the statement, ledger and seller balances', () => {
    expect(grouped(navFor({ ...MEMBER_ABILITIES, viewLedger: true }))[1]).toEqual(['Guild office', ['Statement', 'Ledger', 'Seller balances']]);
  });

  it('gives a new quilter the starter bundles in the exchange and nothing of the office', () => {
    const newQuilter = labels(navFor({ ...MEMBER_ABILITIES, claimStarter: true }));
    expect(newQuilter).toContain('Starter bundles');
    expect(newQuilter).not.toContain('Waiting list');
    expect(navGroups(navFor({ ...MEMBER_ABILITIES, claimStarter: true })).map((group) => group.id)).toEqual(['exchange', 'you']);
  });

  it('follows each ability separately, not a role', () => {
    const everyone = ['Home', 'Shelf', 'Wishes', 'Basket', 'Orders', 'Meetings', 'Dashboard', 'Profile', 'Account'];
    expect(labels(navFor(NO_ABILITIES))).toEqual(everyone);
    expect(labels(navFor({ ...NO_ABILITIES, manageSettings: true }))).toEqual([...everyone.slice(0, 7), 'Guild settings', 'Postage table', ...YOU]);
    expect(labels(navFor({ ...NO_ABILITIES, manageMembers: true }))).toEqual([...everyone.slice(0, 7), 'Members', ...YOU]);
  });

  it('uses the same rule for the route guard as for the menu', () => {
    for (const entry of NAV_ENTRIES) {
      expect(canOpen(entry.page, MEMBER_ABILITIES)).toBe(navFor(MEMBER_ABILITIES).includes(entry));
    }
    expect(canOpen(paths.app.members, MEMBER_ABILITIES)).toBe(false);
  });

  it('keeps each section’s entries together, so the home page’s list reads in the menu’s order', () => {
    const sectionOrder = NAV_SECTIONS.map((section) => section.id);
    const positions = NAV_ENTRIES.map((entry) => sectionOrder.indexOf(entry.section));
    expect(positions).toEqual([...positions].sort((a, b) => a - b));
    expect(navGroups(NAV_ENTRIES).flatMap((group) => group.entries)).toEqual(NAV_ENTRIES);
  });
});

describe('the current page in the menu', () => {
  const all = NAV_ENTRIES;
  const current = (pathname: string) => currentNavEntry(pathname, all)?.label;

  it('marks the page itself, and a page below it by its nearest menu entry', () => {
    expect(current('/shelf')).toBe('Shelf');
    expect(current('/orders/ord-7')).toBe('Orders');
    expect(current('/orders/ord-7/packing-slip')).toBe('Orders');
    expect(current('/review/b-2')).toBe('Review queue');
    expect(current('/meetings/m-1/handovers')).toBe('Meetings');
    expect(current('/account/address')).toBe('Account');
  });

  it('prefers the longer entry where one menu path lies under another', () => {
    expect(current('/my-bundles/new')).toBe('List a bundle');
    expect(current('/my-bundles')).toBe('My bundles');
    expect(current('/my-bundles/b-9/edit')).toBe('My bundles');
    expect(current('/starter/waitlist')).toBe('Waiting list');
    expect(current('/starter/offers/o-3')).toBe('Starter bundles');
  });

  it('marks Home on the home page only, and nothing for pages outside the menu', () => {
    expect(current('/')).toBe('Home');
    expect(current('/bundles/b-1')).toBeUndefined();
    expect(current('/shelfish')).toBeUndefined();
    expect(current('/shelf/')).toBe('Shelf');
  });

  it('only marks entries the member can see', () => {
    expect(currentNavEntry('/starter/waitlist', navFor({ ...MEMBER_ABILITIES, claimStarter: true }))?.label).toBe('Starter bundles');
    expect(currentNavEntry('/admin/members', navFor(MEMBER_ABILITIES))).toBeUndefined();
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
