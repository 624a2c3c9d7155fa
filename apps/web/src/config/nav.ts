import type { UserAbilities } from '@scrap-relay/shared';
import type { ComponentType } from 'react';
import { BasketCount } from '../components/basket-count.tsx';
import { paths, type Ability, type AppPage } from './paths.ts';

export interface NavEntry {
  readonly label: string;
  readonly page: AppPage;
  /** One line for the home page's "where to go" list; entries without one are left off it. */
  readonly description?: string;
  /** A live count shown beside the label (the basket's bundles). */
  readonly Count?: ComponentType;
}

/**
 * The main navigation, in display order. A new page adds one line here (and its
 * path in `paths.ts`, where `requires` decides who sees it).
 */
export const NAV_ENTRIES: readonly NavEntry[] = [
  { label: 'Home', page: paths.app.home },
  { label: 'Shelf', page: paths.app.shelf, description: 'Browse the bundles on offer: filter by cut, fibre, colour, weight and price.' },
  { label: 'Wishes', page: paths.app.wishes, description: 'Standing requests: an e-mail when a matching bundle is approved.' },
  { label: 'List a bundle', page: paths.app.newBundle, description: 'Photos, contents, weight and offer: put a bag of scraps up for review.' },
  { label: 'My bundles', page: paths.app.myBundles, description: 'Everything you have listed, its state, and the librarian’s notes.' },
  { label: 'Basket', page: paths.app.basket, Count: BasketCount },
  { label: 'Orders', page: paths.app.orders, description: 'What you bought and what of yours found a new home: pay, post, track, mark received.' },
  { label: 'Starter bundles', page: paths.app.starter, description: 'Free bundles for new quilters: claim one, or join the waiting list.' },
  { label: 'Meetings', page: paths.app.meetings, description: 'When and where the guild meets, where bundles change hands.' },
  { label: 'Dashboard', page: paths.app.dashboard, description: 'What the exchange has done: weight and bundles rehomed, with charts.' },
  { label: 'Review queue', page: paths.app.review, description: 'Listings waiting for a librarian: approve them onto the shelf or return them with notes.' },
  { label: 'Waiting list', page: paths.app.waitlist, description: 'The starter programme’s queue, open offers, and removing someone.' },
  { label: 'Librarian report', page: paths.app.librarianReport, description: 'Reviews, starter claims and handovers done or missed, by period.' },
  { label: 'Statement', page: paths.app.statement, description: 'The month-end statement from the ledger, to print or download.' },
  { label: 'Ledger', page: paths.app.ledger, description: 'Every money movement, filtered by date and kind, with a CSV for the books.' },
  { label: 'Seller balances', page: paths.app.sellerBalances, description: 'What the guild owes each seller, and recording payouts.' },
  { label: 'Members', page: paths.app.members, description: 'Roles, new-quilter flags, and deactivating or reactivating accounts.' },
  {
    label: 'Guild settings',
    page: paths.app.guildSettings,
    description: 'Fees, units, shelf and starter-bundle rules, and the invite code.',
  },
  { label: 'Postage table', page: paths.app.postageTable, description: 'Zones, weight bands, packaging and handling that postage quotes come from.' },
  { label: 'Profile', page: paths.app.profile, description: 'Your name, units, e-mail choices, history and data.' },
  { label: 'Account', page: paths.app.account, description: 'Your sign-in details, and signing out.' },
];

export function canOpen(page: AppPage, abilities: UserAbilities): boolean {
  if (page.requires === undefined) return true;
  const any: readonly Ability[] = typeof page.requires === 'string' ? [page.requires] : page.requires;
  return any.some((ability) => abilities[ability]);
}

export function navFor(abilities: UserAbilities, entries: readonly NavEntry[] = NAV_ENTRIES): NavEntry[] {
  return entries.filter((entry) => canOpen(entry.page, abilities));
}
