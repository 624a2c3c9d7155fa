import type { UserAbilities } from '@scrap-relay/shared';
import { paths, type AppPage } from './paths.ts';

export interface NavEntry {
  readonly label: string;
  readonly page: AppPage;
  /** One line for the home page's "where to go" list; entries without one are left off it. */
  readonly description?: string;
}

/**
 * The main navigation, in display order. A new page adds one line here (and its
 * path in `paths.ts`, where `requires` decides who sees it).
 */
export const NAV_ENTRIES: readonly NavEntry[] = [
  { label: 'Home', page: paths.app.home },
  { label: 'Members', page: paths.app.members, description: 'Roles, new-quilter flags, and deactivating or reactivating accounts.' },
  {
    label: 'Guild settings',
    page: paths.app.guildSettings,
    description: 'Fees, units, shelf and starter-bundle rules, and the invite code.',
  },
  { label: 'Account', page: paths.app.account, description: 'Your sign-in details, and signing out.' },
];

export function canOpen(page: AppPage, abilities: UserAbilities): boolean {
  return page.requires === undefined || abilities[page.requires];
}

export function navFor(abilities: UserAbilities, entries: readonly NavEntry[] = NAV_ENTRIES): NavEntry[] {
  return entries.filter((entry) => canOpen(entry.page, abilities));
}
