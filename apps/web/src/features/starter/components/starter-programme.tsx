import type { BundleView, UnitSystem } from '@scrap-relay/shared';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { paths } from '../../../config/paths.ts';
import { useMeetings } from '../../../lib/meetings.ts';
import { formatDateTime } from '../../../utils/meetings.ts';
import { useStarterBundles } from '../api/get-starter-bundles.ts';
import type { StarterClaimResult } from '../types.ts';
import { ClaimDialog } from './claim-dialog.tsx';
import { EligibilityNotice } from './eligibility-notice.tsx';
import { MyClaims } from './my-claims.tsx';
import { ProgrammeExplainer } from './programme-explainer.tsx';
import { StarterBundleCard } from './starter-bundle-card.tsx';
import { WaitlistPanel } from './waitlist-panel.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

type Outcome = { kind: 'claimed'; title: string; meetingId: string | null } | { kind: 'taken' };

export interface StarterProgrammeProps {
  units: UnitSystem;
  /** The librarian's links (waiting list, making up a starter bundle). */
  runsProgramme: boolean;
  /** May list bundles, so a member who is not a new quilter is shown how to give a starter bundle. */
  canGive: boolean;
}

/** The member's starter-programme page: how it works, their standing, what is free, the waiting list and their claims. */
export function StarterProgramme({ units, runsProgramme, canGive }: StarterProgrammeProps) {
  const timeZone = useGuildTimeZone();
  const starter = useStarterBundles();
  const meetings = useMeetings('upcoming');
  const [claiming, setClaiming] = useState<BundleView | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);

  const startClaim = (bundle: BundleView) => {
    setOutcome(null);
    setClaiming(bundle);
  };
  const claimed = (result: StarterClaimResult, bundle: BundleView) => {
    setClaiming(null);
    setOutcome({ kind: 'claimed', title: bundle.title, meetingId: result.claim.meetingId });
  };
  const taken = () => {
    setClaiming(null);
    setOutcome({ kind: 'taken' });
  };

  return (
    <>
      {runsProgramme ? <LibrarianLinks /> : null}
      {starter.isPending ? <Loading label="Loading the starter bundles…" /> : null}
      {starter.isError ? (
        <Alert tone="error" title="The starter programme could not be loaded">
          <p>{starter.error.message}</p>
          <Button variant="secondary" onClick={() => starter.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : null}
      {starter.isSuccess ? (
        <>
          {outcome?.kind === 'claimed' ? (
            <Alert tone="success" title={`“${outcome.title}” is yours`}>
              <ClaimedWhere meetingId={outcome.meetingId} meetings={meetings.data?.items ?? []} />
            </Alert>
          ) : null}
          {outcome?.kind === 'taken' ? (
            <Alert tone="warning" title="Someone else claimed it a moment ago">
              <p>If another one is free, you can claim that instead; if not, join the waiting list below and the next one is offered to you in turn.</p>
            </Alert>
          ) : null}

          {starter.data.status.offer ? (
            <Alert tone="warning" title={`A starter bundle is waiting for you: “${starter.data.status.offer.title}”`}>
              <p>Please answer by {formatDateTime(starter.data.status.offer.expiresAt, timeZone)}; after that it goes to the next person in line and you leave the waiting list.</p>
              <ButtonLink to={paths.app.starterOffer.getHref(starter.data.status.offer.id)}>Accept it or pass it on</ButtonLink>
            </Alert>
          ) : null}

          <Panel title="Your standing">
            <EligibilityNotice eligibility={starter.data.status.eligibility} canGive={canGive} />
          </Panel>

          {starter.data.items.length > 0 ? (
            <Panel title="Free starter bundles">
              <ul className="grid gap-4 sm:grid-cols-2">
                {starter.data.items.map((bundle) => (
                  <StarterBundleCard key={bundle.id} bundle={bundle} units={units} onClaim={startClaim} postingAllowed={starter.data.status.rules.postingAllowed} />
                ))}
              </ul>
            </Panel>
          ) : null}

          <WaitlistPanel status={starter.data.status} freeCount={starter.data.items.length} />
          <MyClaims claims={starter.data.status.claims} />
        </>
      ) : null}
      <ProgrammeExplainer rules={starter.data?.status.rules} />
      {claiming ? <ClaimDialog bundle={claiming} onClaimed={claimed} onTaken={taken} onClose={() => setClaiming(null)} /> : null}
    </>
  );
}

function ClaimedWhere({ meetingId, meetings }: { meetingId: string | null; meetings: { id: string; startsAt: string; place: string }[] }) {
  const timeZone = useGuildTimeZone();
  const meeting = meetings.find((m) => m.id === meetingId);
  if (meeting) return <p>Collect it at the meeting on {formatDateTime(meeting.startsAt, timeZone)}, {meeting.place}. We have sent you an e-mail too.</p>;
  return <p>No guild meeting is set yet: it is held for you, and we will e-mail you the date and place as soon as the guild sets its next meeting.</p>;
}

function LibrarianLinks() {
  return (
    <Panel title="Running the programme">
      <ul className="space-y-3">
        <li>
          <Link to={paths.app.waitlist.getHref()} className="font-semibold">
            The waiting list
          </Link>{' '}
          — who is in the queue, any open offers, and removing someone with a reason.
        </li>
        <li>
          <Link to={paths.app.newBundle.getHref()} className="font-semibold">
            Make up a starter bundle
          </Link>{' '}
          — use the ordinary listing form and choose the offer “Starter bundle”. Once approved it goes to the first person waiting, or appears here
          for any new quilter.
        </li>
      </ul>
    </Panel>
  );
}
