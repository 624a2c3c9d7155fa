import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation, useSearchParams } from 'react-router-dom';
import { canOpen } from '../config/nav.ts';
import { isSafeRedirect, paths, type AppPage } from '../config/paths.ts';
import { useSession } from '../features/auth/api/get-session.ts';
import { NotAvailable } from './routes/not-available.tsx';

/** Signed-in pages: visitors go to sign in and come back here afterwards. */
export function RequireSignedIn({ children }: { children?: ReactNode }) {
  const session = useSession();
  const location = useLocation();
  if (!session.data?.user) {
    return <Navigate to={paths.auth.signIn.getHref(`${location.pathname}${location.search}`)} replace />;
  }
  return children ?? <Outlet />;
}

/** Pages for some officers only: everyone else is told plainly, not bounced elsewhere. */
export function RequireAbility({ page, children }: { page: AppPage; children?: ReactNode }) {
  const user = useSession().data?.user;
  if (!user || !canOpen(page, user.abilities)) return <NotAvailable page={page} />;
  return children ?? <Outlet />;
}

/**
 * Sign in, join, forgot password: a signed-in member is sent on, to where they
 * were headed or else to `onwards`. This is also how these pages leave after
 * success (the session gains its user), so there is one navigation, not two racing.
 */
export function SignedOutOnly({ onwards = paths.app.home.getHref(), children }: { onwards?: string; children?: ReactNode }) {
  const session = useSession();
  const [search] = useSearchParams();
  if (session.data?.user) {
    const redirectTo = search.get('redirectTo');
    return <Navigate to={isSafeRedirect(redirectTo) ? redirectTo : onwards} replace />;
  }
  return children ?? <Outlet />;
}
