import type { UserAbilities } from '@scrap-relay/shared';
import type { ComponentType } from 'react';
import { BasketCount } from '../components/basket-count.tsx';
import { paths, type Ability, type AppPage } from './paths.ts';

/**
 * The menu's groups, in display order: the exchange every member uses, the
 * officers' pages, and the member's own settings. Section ids are stable; labels
 * are what members read.
 */
export const NAV_SECTIONS = [
  { id: 'exchange', label: 'Exchange' },
  { id: 'office', label: 'Guild office' },
  { id: 'you', label: 'You' },
] as const;

export type NavSectionId = (typeof NAV_SECTIONS)[number]['id'];

export interface NavCountProps {
  readonly onMenuButton?: boolean;
}

export interface NavEntry {
  readonly label: string;
  readonly page: AppPage;
  readonly section: NavSectionId;
  /** One line for the home page's "where to go" list; entries without one are left off it. */
  readonly description?: string;
  /**
   * A live count shown beside the label (the basket's bundles), and on the phone's
   * closed Menu button, where `onMenuButton` asks it to name what it counts in full.
   */
  readonly Count?: ComponentType<NavCountProps>;
}

/**
 * The main navigation, in display order within each section. A new page adds one
 * line here (and its path in `paths.ts`, where `requires` decides who sees it).
 */
export const NAV_ENTRIES: readonly NavEntry[] = [
  { label: 'Home', section: 'exchange', page: paths.app.home },
  { label: 'Shelf', section: 'exchange', page: paths.app.shelf, description: 'Browse the bundles on offer: filter by cut, fibre, colour, weight and price.' },
  { label: 'Wishes', section: 'exchange', page: paths.app.wishes, description: 'Standing requests: an e-mail when a matching bundle is approved.' },
  { label: 'List a bundle', section: 'exchange', page: paths.app.newBundle, description: 'Photos, contents, weight and offer: put a bag of scraps up for review.' },
  { label: 'My bundles', section: 'exchange', page: paths.app.myBundles, description: 'Everything you have listed, its state, and the librarian’s notes.' },
  { label: 'Basket', section: 'exchange', page: paths.app.basket, Count: BasketCount },
  { label: 'Orders', section: 'exchange', page: paths.app.orders, description: 'What you bought and what of yours found a new home: pay, post, track, mark received.' },
  { label: 'Starter bundles', section: 'exchange', page: paths.app.starter, description: 'Free bundles for new quilters: claim one, or join the waiting list.' },
  { label: 'Meetings', section: 'exchange', page: paths.app.meetings, description: 'When and where the guild meets, where bundles change hands.' },
  { label: 'Dashboard', section: 'exchange', page: paths.app.dashboard, description: 'What the exchange has done: weight and bundles rehomed, with charts.' },
  { label: 'Review queue', section: 'office', page: paths.app.review, description: 'Listings waiting for a librarian: approve them onto the shelf or return them with notes.' },
  { label: 'Waiting list', section: 'office', page: paths.app.waitlist, description: 'The starter programme’s queue, open offers, and removing someone.' },
  { label: 'Librarian report', section: 'office', page: paths.app.librarianReport, description: 'Reviews, starter claims and handovers done or missed, by period.' },
  { label: 'Statement', section: 'office', page: paths.app.statement, description: 'The month-end statement from the ledger, to print or download.' },
  { label: 'Ledger', section: 'office', page: paths.app.ledger, description: 'Every money movement, filtered by date and kind, with a CSV for the books.' },
  { label: 'Seller balances', section: 'office', page: paths.app.sellerBalances, description: 'What the guild owes each seller, and recording payouts.' },
  { label: 'Members', section: 'office', page: paths.app.members, description: 'Roles, new-quilter flags, and deactivating or reactivating accounts.' },
  {
    label: 'Guild settings',
    section: 'office',
    page: paths.app.guildSettings,
    description: 'Fees, units, shelf and starter-bundle rules, and the invite code.',
  },
  { label: 'Postage table', section: 'office', page: paths.app.postageTable, description: 'Zones, weight bands, packaging and handling that postage quotes come from.' },
  { label: 'Profile', section: 'you', page: paths.app.profile, description: 'Your name, units, e-mail choices, history and data.' },
  { label: 'Account', section: 'you', page: paths.app.account, description: 'Your sign-in details, and signing out.' },
];

export function canOpen(page: AppPage, abilities: UserAbilities): boolean {
  if (page.requires === undefined) return true;
  const any: readonly Ability[] = typeof page.requires === 'string' ? [page.requires] : page.requires;
  return any.some((ability) => abilities[ability]);
}

export function navFor(abilities: UserAbilities, entries: readonly NavEntry[] = NAV_ENTRIES): NavEntry[] {
  return entries.filter((entry) => canOpen(entry.page, abilities));
}

export interface NavGroup {
  readonly id: NavSectionId;
  readonly label: string;
  readonly entries: readonly NavEntry[];
}

/** The given entries under their section headings, in section order; a section with nothing to show is left out. */
export function navGroups(entries: readonly NavEntry[]): NavGroup[] {
  return NAV_SECTIONS.map((section) => ({ ...section, entries: entries.filter((entry) => entry.section === section.id) }))
    .filter((group) => group.entries.length > 0);
}

/**
 * The menu entry for the page at `pathname`: the entry with the longest path that
 * is the page itself or a folder above it (an order belongs to Orders, the
 * listing form to "List a bundle" rather than "My bundles"). Home only marks itself.
 */
export function currentNavEntry(pathname: string, entries: readonly NavEntry[]): NavEntry | undefined {
  const trimmed = pathname.length > 1 ? pathname.replace(/\/+$/, '') : pathname;
  let best: NavEntry | undefined;
  for (const entry of entries) {
    const path = entry.page.path;
    const matches = path === '/' ? trimmed === '/' : trimmed === path || trimmed.startsWith(`${path}/`);
    if (matches && (best === undefined || path.length > best.page.path.length)) best = entry;
  }
  return best;
}
