import { Page } from '../../../../components/layouts/page.tsx';
import { useSession } from '../../../../features/auth/api/get-session.ts';
import { AddressEditor } from '../../../../features/checkout/components/address-editor.tsx';

export function Component() {
  const currency = useSession().data?.guild.currency ?? 'USD';
  return (
    <Page
      title="Your postal address"
      width="narrow"
      intro="Used to fill in checkout by post. Only the seller of an order you have paid for sees it, to post your bundles; it is never shown on a listing."
    >
      <AddressEditor currency={currency} />
    </Page>
  );
}
