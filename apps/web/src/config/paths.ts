import type { UserAbilities } from '@scrap-relay/shared';

export type Ability = keyof UserAbilities;

/** A signed-in page; `requires` names the ability the route guard and the navigation both check. */
export interface AppPage {
  readonly path: string;
  /** Parameterised pages (`/bundles/:id`) take their ids; menu entries are pages without parameters. */
  readonly getHref: (...args: never[]) => string;
  /** One ability, or a list of which any one opens the page (starter bundles: new quilters and the librarians who run the programme). */
  readonly requires?: Ability | readonly Ability[];
}

/** Only same-site paths may be used as a return address after sign-in (no `//host` tricks). */
export function isSafeRedirect(target: string | null | undefined): target is string {
  return typeof target === 'string' && target.startsWith('/') && !target.startsWith('//') && !target.startsWith('/\\');
}

const withQuery = (path: string, query: Record<string, string | null | undefined>): string => {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value) params.set(key, value);
  const search = params.toString();
  return search ? `${path}?${search}` : path;
};

/**
 * Every URL the web app knows. The API builds the e-mailed links from the same
 * paths (`/verify-email?token=…`, `/reset-password?token=…`), so keep those stable.
 */
export const paths = {
  auth: {
    signIn: {
      path: '/sign-in',
      getHref: (redirectTo?: string | null) =>
        withQuery('/sign-in', { redirectTo: isSafeRedirect(redirectTo) && redirectTo !== '/' ? redirectTo : null }),
    },
    join: { path: '/join', getHref: () => '/join' },
    checkEmail: { path: '/check-email', getHref: () => '/check-email' },
    verifyEmail: { path: '/verify-email', getHref: (token: string) => withQuery('/verify-email', { token }) },
    forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
    resetPassword: { path: '/reset-password', getHref: (token: string) => withQuery('/reset-password', { token }) },
  },
  app: {
    home: { path: '/', getHref: () => '/' },
    account: { path: '/account', getHref: () => '/account' },
    members: { path: '/admin/members', getHref: () => '/admin/members', requires: 'manageMembers' },
    guildSettings: { path: '/admin/guild-settings', getHref: () => '/admin/guild-settings', requires: 'manageSettings' },
    newBundle: { path: '/my-bundles/new', getHref: () => '/my-bundles/new', requires: 'listBundles' },
    myBundles: { path: '/my-bundles', getHref: () => '/my-bundles', requires: 'listBundles' },
    editBundle: {
      path: '/my-bundles/:id/edit',
      getHref: (id: string, step?: string | null) => withQuery(`/my-bundles/${encodeURIComponent(id)}/edit`, { step }),
      requires: 'listBundles',
    },
    bundle: { path: '/bundles/:id', getHref: (id: string) => `/bundles/${encodeURIComponent(id)}` },
    /** `search` is a shelf query string (the shared `shelfSearchParams`), so a link opens a filtered shelf. */
    shelf: { path: '/shelf', getHref: (search?: string) => (search ? `/shelf?${search}` : '/shelf') },
    wishes: { path: '/wishes', getHref: () => '/wishes' },
    review: { path: '/review', getHref: () => '/review', requires: 'reviewBundles' },
    reviewBundle: { path: '/review/:id', getHref: (id: string) => `/review/${encodeURIComponent(id)}`, requires: 'reviewBundles' },
    starter: { path: '/starter', getHref: () => '/starter', requires: ['claimStarter', 'runStarterProgramme'] },
    /** Linked from the waiting-list offer e-mail. */
    starterOffer: { path: '/starter/offers/:offerId', getHref: (offerId: string) => `/starter/offers/${encodeURIComponent(offerId)}`, requires: 'claimStarter' },
    waitlist: { path: '/starter/waitlist', getHref: () => '/starter/waitlist', requires: 'runStarterProgramme' },
    meetings: { path: '/meetings', getHref: () => '/meetings' },
    /** The API decides who may open a sheet (librarians and admins); the page says so to anyone else. */
    handoverSheet: { path: '/meetings/:meetingId/handovers', getHref: (meetingId: string) => `/meetings/${encodeURIComponent(meetingId)}/handovers` },
    /** Opened by scanning a handover's QR code at the door. */
    handoverCheckOff: { path: '/handovers/:handoverId', getHref: (handoverId: string) => `/handovers/${encodeURIComponent(handoverId)}` },
    dashboard: { path: '/dashboard', getHref: (search?: string) => (search ? `/dashboard?${search}` : '/dashboard') },
    statement: { path: '/reports/statement', getHref: (month?: string) => withQuery('/reports/statement', { month }), requires: 'viewLedger' },
    librarianReport: { path: '/reports/librarian', getHref: () => '/reports/librarian', requires: 'runStarterProgramme' },
    profile: { path: '/profile', getHref: () => '/profile' },
    basket: { path: '/basket', getHref: () => '/basket' },
    /** Bundle pages' "Add to basket" link: adds the bundle (once, however often it is opened) and shows the basket. */
    basketAdd: { path: '/basket/add/:id', getHref: (bundleId: string) => `/basket/add/${encodeURIComponent(bundleId)}` },
    orders: { path: '/orders', getHref: (as?: 'buyer' | 'seller') => (as === 'seller' ? '/orders?as=seller' : '/orders') },
    /** Linked from order e-mails; the payment page comes back here with `?paid=<session id>`. */
    order: { path: '/orders/:id', getHref: (id: string) => `/orders/${encodeURIComponent(id)}` },
    packingSlip: { path: '/orders/:id/packing-slip', getHref: (id: string) => `/orders/${encodeURIComponent(id)}/packing-slip` },
    address: { path: '/account/address', getHref: () => '/account/address' },
    ledger: { path: '/treasurer/ledger', getHref: () => '/treasurer/ledger', requires: 'viewLedger' },
    sellerBalances: { path: '/treasurer/balances', getHref: () => '/treasurer/balances', requires: 'viewLedger' },
    postageTable: { path: '/admin/postage', getHref: () => '/admin/postage', requires: 'manageSettings' },
  },
} as const satisfies { auth: Record<string, { path: string; getHref: (...args: never[]) => string }>; app: Record<string, AppPage> };
