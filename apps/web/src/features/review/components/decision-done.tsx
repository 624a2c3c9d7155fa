import { Alert } from '../../../components/ui/alert.tsx';
import type { ReviewOutcome } from './review-decision-form.tsx';

/** What the librarian's decision did, shown once on the queue: where the bundle went and who was e-mailed. */
export function DecisionDone({ outcome }: { outcome: ReviewOutcome }) {
  if (outcome.decision === 'return') {
    return (
      <Alert tone="success" title={`Returned “${outcome.title}” with your notes`}>
        <p>The seller has been e-mailed your notes and can edit the bundle and send it again.</p>
      </Alert>
    );
  }
  return (
    <Alert tone="success" title={`Approved “${outcome.title}”`}>
      <p>
        {outcome.offer === 'starter'
          ? // Starter bundles are not matched against wishes: they go to the waiting list, longest waiting first.
            'It is in the starter programme now: it is offered to the new quilter who has waited longest on the waiting list, or, with nobody waiting, any new quilter may claim it. The member who gave it has been e-mailed.'
          : 'It is on the shelf now. The seller has been e-mailed, and so has every member whose wish it matches.'}
      </p>
    </Alert>
  );
}
