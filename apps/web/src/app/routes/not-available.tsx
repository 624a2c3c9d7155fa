import { paths } from '../../config/paths.ts';
import { Page } from '../../components/layouts/page.tsx';
import { ButtonLink } from '../../components/ui/button.tsx';

/** Shown in place of a page the member's roles do not open (rendered by the route guard, not a route of its own). */
export function NotAvailable() {
  return (
    <Page title="Not available for your account" width="narrow">
      <p>
        This page is for guild officers with a particular role. If you think your account should have it, ask one of your
        guild’s admins.
      </p>
      <ButtonLink to={paths.app.home.getHref()} variant="secondary">
        Back to your home page
      </ButtonLink>
    </Page>
  );
}
