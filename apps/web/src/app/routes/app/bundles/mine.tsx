import { paths } from '../../../../config/paths.ts';
import { Page } from '../../../../components/layouts/page.tsx';
import { ButtonLink } from '../../../../components/ui/button.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { MyBundles } from '../../../../features/bundles/components/my-bundles.tsx';

export function Component() {
  const user = useSessionUser();
  return (
    <Page
      title="My bundles"
      intro="Everything you have listed, in every state. Drafts wait for you to finish them; returned bundles carry the librarian’s note."
      width="wide"
      actions={<ButtonLink to={paths.app.newBundle.getHref()}>List a bundle</ButtonLink>}
    >
      <MyBundles units={user.units} />
    </Page>
  );
}
