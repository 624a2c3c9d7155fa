import { Panel } from '../../../components/layouts/page.tsx';
import { formatDateTime } from '../../../utils/meetings.ts';
import { formatDate } from '../../../utils/format.ts';
import type { StarterClaimSummary } from '../types.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

const STATE_TEXT: Record<StarterClaimSummary['state'], string> = {
  claimed: 'Waiting to be collected',
  handed_over: 'Collected',
  cancelled: 'Cancelled',
};

/** The starter bundles the member has claimed, with where to collect the ones still waiting. */
export function MyClaims({ claims }: { claims: StarterClaimSummary[] }) {
  const timeZone = useGuildTimeZone();
  if (claims.length === 0) return null;
  return (
    <Panel title="Your starter bundles">
      <ul className="divide-y-2 divide-seam">
        {claims.map((claim) => (
          <li key={claim.id} className="space-y-1 py-3 first:pt-0 last:pb-0">
            <p className="text-lg font-semibold">{claim.bundle.title}</p>
            <p>
              <span className="font-semibold">{STATE_TEXT[claim.state]}</span> · claimed on {formatDate(claim.claimedAt, timeZone)}
            </p>
            {claim.state === 'claimed' ? (
              <p>
                {claim.meeting
                  ? `Collect it at the meeting on ${formatDateTime(claim.meeting.startsAt, timeZone)}, ${claim.meeting.place}.`
                  : 'No guild meeting is set yet: it is held for you, and we will e-mail you the date and place as soon as the guild sets its next meeting.'}
              </p>
            ) : null}
          </li>
        ))}
      </ul>
    </Panel>
  );
}
