import { useLocation, useNavigate, useParams } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Page } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../../components/ui/button.tsx';
import { Loading } from '../../../../components/ui/loading.tsx';
import { isApiError } from '../../../../lib/api-client.ts';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { useBundleForReview } from '../../../../features/review/api/get-bundle-for-review.ts';
import { BundleReview } from '../../../../features/review/components/bundle-review.tsx';
import { queueReturnSearch } from '../../../../features/review/utils/queue-search.ts';
import type { ReviewQueueState } from './review-queue.tsx';

export function Component() {
  const { id = '' } = useParams();
  const user = useSessionUser();
  const navigate = useNavigate();
  const location = useLocation();
  const bundle = useBundleForReview(id);
  // The queue as the librarian left it: its sort, filters and page came along in the link's history state.
  const queueHref = `${paths.app.review.getHref()}${queueReturnSearch(location.state)}`;
  const backToQueue = (
    <ButtonLink to={queueHref} variant="secondary">
      ← Back to the queue
    </ButtonLink>
  );

  if (bundle.isPending) {
    return (
      <Page title="Review a bundle" width="wide">
        <Loading label="Loading the bundle…" />
      </Page>
    );
  }
  if (bundle.isError) {
    const gone = isApiError(bundle.error) && bundle.error.code === 'not_found';
    return (
      <Page title={gone ? 'This bundle is not in the queue' : 'Review a bundle'} width="wide" actions={backToQueue}>
        <Alert tone="error" title={gone ? 'It may have been withdrawn by its seller, or reviewed by another librarian.' : bundle.error.message}>
          {gone ? null : (
            <Button variant="secondary" onClick={() => bundle.refetch()} isPending={bundle.isFetching} pendingLabel="Trying…">
              Try again
            </Button>
          )}
        </Alert>
      </Page>
    );
  }

  return (
    <Page title={`Review: ${bundle.data.bundle.title}`} width="wide" actions={backToQueue}>
      <BundleReview
        bundle={bundle.data.bundle}
        units={user.units}
        onDecided={(decided) => void navigate(queueHref, { state: { decided } satisfies ReviewQueueState })}
      />
    </Page>
  );
}
