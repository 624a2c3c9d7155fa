import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { paths, type AppPage } from '../config/paths.ts';
import { Loading } from '../components/ui/loading.tsx';
import { RequireAbility, RequireSignedIn, SignedOutOnly } from './guards.tsx';
import { RootErrorBoundary, RootLayout } from './routes/root.tsx';

type LazyRoute = NonNullable<RouteObject['lazy']>;

/** A signed-in page; when the page `requires` an ability the guard shows "not available" to everyone else. */
function appPage(page: AppPage, lazy: LazyRoute): RouteObject {
  if (!page.requires) return { path: page.path, lazy };
  return { path: page.path, element: <RequireAbility page={page} />, children: [{ index: true, lazy }] };
}

/**
 * Every route. Pages load on first visit (lazy). To add a page: its path in
 * `config/paths.ts`, a route module under `app/routes/`, one line below, and —
 * if it belongs in the menu — one entry in `config/nav.ts`.
 */
export const routes: RouteObject[] = [
  {
    path: '/',
    element: <RootLayout />,
    errorElement: <RootErrorBoundary />,
    hydrateFallbackElement: <Loading />,
    children: [
      {
        element: <SignedOutOnly />,
        children: [
          { path: paths.auth.signIn.path, lazy: () => import('./routes/auth/sign-in.tsx') },
          { path: paths.auth.forgotPassword.path, lazy: () => import('./routes/auth/forgot-password.tsx') },
        ],
      },
      {
        // A new member is signed in by joining, with the e-mail still to confirm.
        element: <SignedOutOnly onwards={paths.auth.checkEmail.getHref()} />,
        children: [{ path: paths.auth.join.path, lazy: () => import('./routes/auth/join.tsx') }],
      },
      // Links from e-mails: they work whether or not the reader is signed in on this device.
      { path: paths.auth.verifyEmail.path, lazy: () => import('./routes/auth/verify-email.tsx') },
      { path: paths.auth.resetPassword.path, lazy: () => import('./routes/auth/reset-password.tsx') },
      {
        element: <RequireSignedIn />,
        children: [
          { index: true, lazy: () => import('./routes/app/home.tsx') },
          { path: paths.auth.checkEmail.path, lazy: () => import('./routes/auth/check-email.tsx') },
          appPage(paths.app.account, () => import('./routes/app/account.tsx')),
          appPage(paths.app.members, () => import('./routes/app/members.tsx')),
          appPage(paths.app.guildSettings, () => import('./routes/app/guild-settings.tsx')),
        ],
      },
      { path: '*', lazy: () => import('./routes/not-found.tsx') },
    ],
  },
];

export const createAppRouter = () => createBrowserRouter(routes);
