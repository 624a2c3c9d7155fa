import { useParams } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Page } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../../components/ui/button.tsx';
import { Loading } from '../../../../components/ui/loading.tsx';
import { isApiError } from '../../../../lib/api-client.ts';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { useBundle } from '../../../../features/bundles/api/get-bundle.ts';
import { BundleStateLabel } from '../../../../features/bundles/components/bundle-state-label.tsx';
import { ListingWizard } from '../../../../features/bundles/components/listing-wizard.tsx';
import { ReviewNotes } from '../../../../features/bundles/components/review-notes.tsx';

export function Component() {
  const { id = '' } = useParams();
  const user = useSessionUser();
  const query = useBundle(id);

  if (query.isPending) {
    return (
      <Page title="Edit a bundle">
        <Loading label="Loading the bundle…" />
      </Page>
    );
  }
  if (query.isError) {
    const notFound = isApiError(query.error) && query.error.status === 404;
    return (
      <Page title="Edit a bundle">
        <Alert tone="error" title={notFound ? 'There is no bundle of yours at this address.' : query.error.message}>
          {notFound ? null : (
            <Button variant="secondary" onClick={() => query.refetch()}>
              Try again
            </Button>
          )}
        </Alert>
        <ButtonLink to={paths.app.myBundles.getHref()} variant="secondary">
          Go to my bundles
        </ButtonLink>
      </Page>
    );
  }

  const { bundle } = query.data;
  const title = bundle.title ? `Edit “${bundle.title}”` : 'Finish your listing';
  if (!bundle.abilities.edit) {
    return (
      <Page title={title} width="narrow">
        <p>
          This bundle is <BundleStateLabel state={bundle.state} offer={bundle.offer} />, so it cannot be changed now. To change it, withdraw it
          first from its page; you can then edit and relist it.
        </p>
        <ButtonLink to={paths.app.bundle.getHref(bundle.id)} variant="secondary">
          Open the bundle’s page
        </ButtonLink>
      </Page>
    );
  }
  return (
    <Page title={title} intro={<span>State: <BundleStateLabel state={bundle.state} offer={bundle.offer} /></span>}>
      {bundle.state === 'returned' && bundle.reviewNotes ? <ReviewNotes notes={bundle.reviewNotes} /> : null}
      <ListingWizard key={bundle.id} bundle={bundle} units={user.units} currency={bundle.currency} />
    </Page>
  );
}
