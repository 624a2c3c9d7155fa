import { Panel } from '../../../components/layouts/page.tsx';
import { ButtonLink } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { paths } from '../../../config/paths.ts';
import { useMyAddress } from '../../../lib/my-address.ts';
import { PostalAddressLines } from '../../../components/postal-address.tsx';

/**
 * Where members find their postal address from their own pages (the account and the profile), not only from
 * checkout: the saved address, or that there is none, and the way to change it.
 */
export function PostalAddressPanel() {
  const address = useMyAddress();
  const saved = address.data?.address ?? null;
  return (
    <Panel title="Postal address">
      <p>
        Fills in checkout when bundles come by post. Only the seller of an order you have paid for sees it, to post your bundles; it is never shown on
        a listing.
      </p>
      {address.isPending ? <Loading label="Loading your address…" /> : null}
      {address.isError ? <p>Your address could not be loaded just now; you can still open it below.</p> : null}
      {address.isSuccess ? (
        saved ? (
          <PostalAddressLines address={saved} />
        ) : (
          <p className="font-semibold">You have not saved an address yet.</p>
        )
      ) : null}
      <ButtonLink to={paths.app.address.getHref()} variant="secondary">
        {saved ? 'Change your postal address' : 'Add your postal address'}
      </ButtonLink>
    </Panel>
  );
}
