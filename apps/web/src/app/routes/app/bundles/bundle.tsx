import { useLocation, useParams } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Page } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../../components/ui/button.tsx';
import { Loading } from '../../../../components/ui/loading.tsx';
import { isApiError } from '../../../../lib/api-client.ts';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { useBundle } from '../../../../features/bundles/api/get-bundle.ts';
import { BundleDetails } from '../../../../features/bundles/components/bundle-details.tsx';
import { PostageToYou } from '../../../../features/bundles/components/postage-to-you.tsx';

export function Component() {
  const { id = '' } = useParams();
  const user = useSessionUser();
  const query = useBundle(id);
  const location = useLocation();
  // The listing form sends the seller here after submitting.
  const justSubmitted = (location.state as { submitted?: boolean } | null)?.submitted === true;

  if (query.isPending) {
    return (
      <Page title="Bundle">
        <Loading label="Loading the bundle…" />
      </Page>
    );
  }
  if (query.isError) {
    const notFound = isApiError(query.error) && query.error.status === 404;
    return (
      <Page title={notFound ? 'This bundle is not on the shelf' : 'Bundle'} width="narrow">
        {notFound ? (
          <p>It may have been rehomed, withdrawn by its owner, or not approved yet. Other bundles are waiting on the shelf.</p>
        ) : (
          <Alert tone="error" title={query.error.message}>
            <Button variant="secondary" onClick={() => query.refetch()}>
              Try again
            </Button>
          </Alert>
        )}
        <ButtonLink to={paths.app.shelf.getHref()} variant="secondary">
          Go to the shelf
        </ButtonLink>
      </Page>
    );
  }

  const { bundle } = query.data;
  return (
    <Page title={bundle.title || 'Untitled draft'} width="wide">
      {justSubmitted && bundle.state === 'in_review' ? (
        <Alert tone="success" title="Sent to the librarian for review">
          <p>You will get an e-mail when it is on the shelf, or if the librarian has a question. It is listed under My bundles meanwhile.</p>
        </Alert>
      ) : null}
      <BundleDetails bundle={bundle} units={user.units} viewerId={user.id} />
      <PostageToYou bundle={bundle} units={user.units} />
    </Page>
  );
}
