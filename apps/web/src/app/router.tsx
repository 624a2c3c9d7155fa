import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { paths, type AppPage } from '../config/paths.ts';
import { Loading } from '../components/ui/loading.tsx';
import { loadShelfPage } from './first-page.ts';
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
          appPage(paths.app.newBundle, () => import('./routes/app/bundles/new.tsx')),
          appPage(paths.app.myBundles, () => import('./routes/app/bundles/mine.tsx')),
          appPage(paths.app.editBundle, () => import('./routes/app/bundles/edit.tsx')),
          appPage(paths.app.bundle, () => import('./routes/app/bundles/bundle.tsx')),
          appPage(paths.app.shelf, loadShelfPage),
          appPage(paths.app.wishes, () => import('./routes/app/wishes/wishes.tsx')),
          appPage(paths.app.review, () => import('./routes/app/review/review-queue.tsx')),
          appPage(paths.app.reviewBundle, () => import('./routes/app/review/review-bundle.tsx')),
          appPage(paths.app.starter, () => import('./routes/app/starter/starter.tsx')),
          appPage(paths.app.starterOffer, () => import('./routes/app/starter/offer.tsx')),
          appPage(paths.app.waitlist, () => import('./routes/app/starter/waitlist.tsx')),
          appPage(paths.app.meetings, () => import('./routes/app/meetings/meetings.tsx')),
          appPage(paths.app.handoverSheet, () => import('./routes/app/handovers/sheet.tsx')),
          appPage(paths.app.handoverCheckOff, () => import('./routes/app/handovers/check-off.tsx')),
          appPage(paths.app.dashboard, () => import('./routes/app/dashboard/dashboard.tsx')),
          appPage(paths.app.statement, () => import('./routes/app/dashboard/statement.tsx')),
          appPage(paths.app.librarianReport, () => import('./routes/app/dashboard/librarian-report.tsx')),
          appPage(paths.app.profile, () => import('./routes/app/profile/profile.tsx')),
          appPage(paths.app.basket, () => import('./routes/app/basket/basket.tsx')),
          appPage(paths.app.basketAdd, () => import('./routes/app/basket/add.tsx')),
          appPage(paths.app.address, () => import('./routes/app/basket/address.tsx')),
          appPage(paths.app.orders, () => import('./routes/app/orders/orders.tsx')),
          appPage(paths.app.order, () => import('./routes/app/orders/order.tsx')),
          appPage(paths.app.packingSlip, () => import('./routes/app/orders/packing-slip.tsx')),
          appPage(paths.app.ledger, () => import('./routes/app/treasurer/ledger.tsx')),
          appPage(paths.app.sellerBalances, () => import('./routes/app/treasurer/balances.tsx')),
          appPage(paths.app.postageTable, () => import('./routes/app/postage/postage-table.tsx')),
        ],
      },
      { path: '*', lazy: () => import('./routes/not-found.tsx') },
    ],
  },
];

export const createAppRouter = () => createBrowserRouter(routes);
