import { useEffect, useState } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { DecisionDone } from '../../../../features/review/components/decision-done.tsx';
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
    // Keep the address's search: it holds the queue's sort, filters and page.
    if ((location.state as ReviewQueueState | null)?.decided) void navigate({ pathname: location.pathname, search: location.search }, { replace: true, state: null });
  }, [location.pathname, location.search, location.state, navigate]);

  return (
    <Page
      title="Review queue"
      intro="Bundles waiting for a librarian before they go on the shelf, longest waiting first. Open one to see its photos and decide."
      width="wide"
    >
      {decided ? <DecisionDone outcome={decided} /> : null}
      <ReviewQueueTable units={user.units} />
    </Page>
  );
}
