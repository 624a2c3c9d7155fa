import { useEffect, useState } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import type { ReviewOutcome } from '../../../../features/review/components/review-decision-form.tsx';
import { ReviewQueueTable } from '../../../../features/review/components/review-queue-table.tsx';

/** What the review page hands back when it returns here after a decision. */
export interface ReviewQueueState {
  decided?: ReviewOutcome;
}

export function Component() {
  const user = useSessionUser();
  const location = useLocation();
  const navigate = useNavigate();
  const [decided] = useState(() => (location.state as ReviewQueueState | null)?.decided ?? null);

  // Shown once: clear it from the history entry so a reload or the back button does not repeat it.
  useEffect(() => {
    if ((location.state as ReviewQueueState | null)?.decided) void navigate(location.pathname, { replace: true, state: null });
  }, [location.pathname, location.state, navigate]);

  return (
    <Page
      title="Review queue"
      intro="Bundles waiting for a librarian before they go on the shelf, longest waiting first. Open one to see its photos and decide."
      width="wide"
    >
      {decided ? (
        <Alert tone="success" title={decided.decision === 'approve' ? `Approved “${decided.title}”` : `Returned “${decided.title}” with your notes`}>
          <p>
            {decided.decision === 'approve'
              ? 'It is on the shelf now. The seller has been e-mailed, and so has every member whose wish it matches.'
              : 'The seller has been e-mailed your notes and can edit the bundle and send it again.'}
          </p>
        </Alert>
      ) : null}
      <ReviewQueueTable units={user.units} />
    </Page>
  );
}
