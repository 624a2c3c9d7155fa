import { paths } from '../../config/paths.ts';
import { Page } from '../../components/layouts/page.tsx';
import { ButtonLink } from '../../components/ui/button.tsx';

export function Component() {
  return (
    <Page title="Page not found" width="narrow">
      <p>There is no page at this address. It may have moved, or the link may be missing a part.</p>
      <ButtonLink to={paths.app.home.getHref()} variant="secondary">
        Go to the home page
      </ButtonLink>
    </Page>
  );
}
