import { Page } from '../../../../components/layouts/page.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { StarterProgramme } from '../../../../features/starter/components/starter-programme.tsx';

export function Component() {
  const user = useSessionUser();
  return (
    <Page title="Starter bundles" intro="Free bundles of fabric for quilters who are just starting out, donated by members and checked by the librarian.">
      <StarterProgramme units={user.units} runsProgramme={user.abilities.runStarterProgramme} canGive={user.abilities.listBundles} />
    </Page>
  );
}
