import type { UserAbilities } from '@scrap-relay/shared';

export type Ability = keyof UserAbilities;

/** A signed-in page; `requires` names the ability the route guard and the navigation both check. */
export interface AppPage {
  readonly path: string;
  readonly getHref: () => string;
  readonly requires?: Ability;
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
  },
} as const satisfies { auth: Record<string, { path: string; getHref: (...args: never[]) => string }>; app: Record<string, AppPage> };
