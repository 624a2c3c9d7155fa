import { Alert } from '../../../components/ui/alert.tsx';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import type { StarterEligibilityView } from '../types.ts';
import { NewQuiltersOnly } from './new-quilters-only.tsx';

/** The member's standing, in plain words: may claim now, not a new quilter (and how to give one instead), or may claim again from a date. */
export function EligibilityNotice({ eligibility, canGive }: { eligibility: StarterEligibilityView; canGive: boolean }) {
  const timeZone = useGuildTimeZone();
  if (eligibility.eligible) {
    return (
      <Alert tone="success" title="You may claim a starter bundle" announce={false}>
        <p>As a new quilter in the guild, you may have a free starter bundle: claim one that is free, or wait your turn on the waiting list.</p>
      </Alert>
    );
  }
  if (eligibility.reason === 'over_limit') {
    return (
      <Alert tone="info" title="You have had your starter bundle for now" announce={false}>
        <p>
          {eligibility.nextEligibleAt
            ? `You may claim another from ${formatDate(eligibility.nextEligibleAt, timeZone)}.`
            : 'You may claim another once the guild’s waiting time has passed.'}{' '}
          The limit lets every new quilter have a turn.
        </p>
      </Alert>
    );
  }
  return (
    <Alert tone="info" title="Starter bundles are kept for new quilters" announce={false}>
      <NewQuiltersOnly canGive={canGive} />
    </Alert>
  );
}
