import { paths, type AppPage } from '../../config/paths.ts';
import { Page } from '../../components/layouts/page.tsx';
import { ButtonLink } from '../../components/ui/button.tsx';
import { useSession } from '../../features/auth/api/get-session.ts';
import { NewQuiltersOnly } from '../../features/starter/components/new-quilters-only.tsx';

const STARTER_PAGES: readonly AppPage[] = [paths.app.starter, paths.app.starterOffer];

/** Shown in place of a page the member's roles do not open (rendered by the route guard, not a route of its own). */
export function NotAvailable({ page }: { page?: AppPage }) {
  const user = useSession().data?.user;
  const home = (
    <ButtonLink to={paths.app.home.getHref()} variant="secondary">
      Back to your home page
    </ButtonLink>
  );
  // The starter programme is closed by being a new quilter, not by an officer's role.
  if (page && STARTER_PAGES.includes(page)) {
    return (
      <Page title="Starter bundles are for new quilters" width="narrow">
        <NewQuiltersOnly canGive={user?.abilities.listBundles ?? false} />
        <div>{home}</div>
      </Page>
    );
  }
  return (
    <Page title="Not available for your account" width="narrow">
      <p>
        This page is for guild officers with a particular role. If you think your account should have it, ask one of your
        guild’s admins.
      </p>
      {home}
    </Page>
  );
}
