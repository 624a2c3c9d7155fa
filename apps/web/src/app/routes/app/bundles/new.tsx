import { Page } from '../../../../components/layouts/page.tsx';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { ListingWizard } from '../../../../features/bundles/components/listing-wizard.tsx';

export function Component() {
  const user = useSessionUser();
  const currency = useSession().data?.guild.currency ?? 'USD';
  return (
    <Page
      title="List a bundle"
      intro="Photos, what is in it, its weight and how it changes hands. Your draft saves as you go; the librarian checks it before it goes on the shelf."
    >
      <ListingWizard bundle={null} units={user.units} currency={currency} />
    </Page>
  );
}
