import { useEffect, useRef } from 'react';
import { Link, Outlet, useLocation, useNavigation, useRouteError } from 'react-router-dom';
import { navFor } from '../../config/nav.ts';
import { paths } from '../../config/paths.ts';
import { AppShell, MAIN_ID } from '../../components/layouts/app-shell.tsx';
import { Page } from '../../components/layouts/page.tsx';
import { Alert } from '../../components/ui/alert.tsx';
import { Button } from '../../components/ui/button.tsx';
import { Loading } from '../../components/ui/loading.tsx';
import { useSession } from '../../features/auth/api/get-session.ts';

/** The frame around every page: header with the guild's name, navigation from the member's abilities, focus on arrival. */
export function RootLayout() {
  const session = useSession();
  const user = session.data?.user ?? null;
  const navigation = useNavigation();
  useFocusOnNavigate();

  const headerEnd = user ? (
    <Link to={paths.app.account.getHref()} className="hidden min-h-11 items-center px-2 font-semibold sm:inline-flex">
      {user.name}
    </Link>
  ) : session.isSuccess ? (
    <div className="flex gap-1">
      <Link to={paths.auth.signIn.getHref()} className="inline-flex min-h-11 items-center px-3 font-semibold">
        Sign in
      </Link>
      <Link to={paths.auth.join.getHref()} className="inline-flex min-h-11 items-center px-3 font-semibold">
        Join
      </Link>
    </div>
  ) : null;

  return (
    <AppShell guildName={session.data?.guild.name} homeHref={paths.app.home.getHref()} nav={user ? navFor(user.abilities) : []} headerEnd={headerEnd}>
      {navigation.state === 'loading' ? (
        <div role="progressbar" aria-label="Opening page" className="fixed inset-x-0 top-0 z-40 h-1.5 animate-pulse bg-madder" />
      ) : null}
      {session.isPending ? (
        <Loading />
      ) : session.isError ? (
        <Page title="Scrap Relay is not answering" width="narrow">
          <Alert tone="error" title={session.error.message} />
          <Button variant="secondary" onClick={() => session.refetch()} isPending={session.isFetching} pendingLabel="Trying…">
            Try again
          </Button>
        </Page>
      ) : (
        <Outlet />
      )}
    </AppShell>
  );
}

/**
 * After moving between pages, put keyboard and screen-reader focus on the new
 * page's heading, as a full page load would start at the top. The first page is
 * left alone (the browser starts at the top by itself). Keyed on the path focus
 * was last handled for, not on "first run": StrictMode runs a mount effect twice
 * in development, and a first-run flag let the second run move focus on load.
 */
function useFocusOnNavigate() {
  const { pathname } = useLocation();
  const handled = useRef(pathname);
  useEffect(() => {
    if (handled.current === pathname) return;
    handled.current = pathname;
    const target = document.querySelector<HTMLElement>('[data-page-heading]') ?? document.getElementById(MAIN_ID);
    target?.focus({ preventScroll: false });
  }, [pathname]);
}

export function RootErrorBoundary() {
  const error = useRouteError();
  console.error(error);
  return (
    <main className="mx-auto max-w-xl space-y-6 px-4 py-10">
      <h1 className="text-3xl font-bold">Something went wrong</h1>
      <p>This page ran into a problem. Reloading usually helps; if it keeps happening, tell your guild’s admin.</p>
      <Button onClick={() => window.location.reload()}>Reload the page</Button>
    </main>
  );
}
