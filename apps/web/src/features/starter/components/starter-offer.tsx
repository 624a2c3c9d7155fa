import type { UnitSystem } from '@scrap-relay/shared';
import { useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { paths } from '../../../config/paths.ts';
import { useMeetings } from '../../../lib/meetings.ts';
import { formatDateTime } from '../../../utils/meetings.ts';
import { useAcceptOffer, useDeclineOffer } from '../api/answer-offer.ts';
import { useBundle } from '../api/get-bundle.ts';
import { useStarterBundles } from '../api/get-starter-bundles.ts';
import { timeLeftText } from '../time-left.ts';
import type { StarterOfferSummary } from '../types.ts';
import { BundleContents, BundlePhoto } from './bundle-contents.tsx';
import { MeetingChoice } from './meeting-choice.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

type Answer = { kind: 'accepted'; title: string; meetingId: string | null } | { kind: 'declined'; title: string };

/**
 * A waiting-list offer, opened from its e-mail: the bundle, the deadline, and
 * Accept (choosing the meeting) or Pass it on. Only the member it was offered to sees it.
 */
export function StarterOffer({ offerId, units }: { offerId: string; units: UnitSystem }) {
  const starter = useStarterBundles();
  const [answer, setAnswer] = useState<Answer | null>(null);

  if (answer) return <AnswerResult answer={answer} />;
  if (starter.isPending) return <Loading label="Loading the offer…" />;
  if (starter.isError) {
    return (
      <Alert tone="error" title="The offer could not be loaded">
        <p>{starter.error.message}</p>
        <Button variant="secondary" onClick={() => starter.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  const offer = starter.data.status.offer;
  if (!offer || offer.id !== offerId) {
    return (
      <Alert tone="info" title="This offer is no longer open" announce={false}>
        <p>
          It has been answered already, or its time ran out and it went to the next person in line. Offers are made only to the person at the front
          of the waiting list.
        </p>
        <ButtonLink to={paths.app.starter.getHref()} variant="secondary">
          See the starter programme
        </ButtonLink>
      </Alert>
    );
  }
  return <OpenOffer offer={offer} units={units} onAnswered={setAnswer} />;
}

function OpenOffer({ offer, units, onAnswered }: { offer: StarterOfferSummary; units: UnitSystem; onAnswered: (answer: Answer) => void }) {
  const timeZone = useGuildTimeZone();
  const bundle = useBundle(offer.bundleId);
  const [meetingId, setMeetingId] = useState('');
  const [confirmDecline, setConfirmDecline] = useState(false);
  const accept = useAcceptOffer({ onSuccess: (result) => onAnswered({ kind: 'accepted', title: offer.title, meetingId: result.claim.meetingId }) });
  const decline = useDeclineOffer({ onSuccess: () => onAnswered({ kind: 'declined', title: offer.title }) });
  const ended = (accept.error ?? decline.error)?.status === 409;

  return (
    <>
      <Alert tone="warning" title={`Please answer by ${formatDateTime(offer.expiresAt, timeZone)}`} announce={false}>
        <p>
          {timeLeftText(offer.expiresAt) ?? 'No time'} left. If you do not answer in time, it goes to the next person waiting and you leave the waiting list.
        </p>
      </Alert>
      <Panel title={offer.title}>
        {bundle.isPending ? <Loading label="Loading the bundle’s details…" /> : null}
        {bundle.isError ? <p>The bundle’s photo and details could not be loaded ({bundle.error.message}); you can still answer.</p> : null}
        {bundle.isSuccess ? (
          <div className="grid gap-4 sm:grid-cols-2">
            <BundlePhoto bundle={bundle.data.bundle} large />
            <div className="space-y-3">
              {bundle.data.bundle.description ? <p>{bundle.data.bundle.description}</p> : null}
              <BundleContents bundle={bundle.data.bundle} units={units} />
            </div>
          </div>
        ) : null}
      </Panel>

      {ended ? (
        <Alert tone="error" title="This offer has ended">
          <p>{(accept.error ?? decline.error)?.message}</p>
          <ButtonLink to={paths.app.starter.getHref()} variant="secondary">
            See the starter programme
          </ButtonLink>
        </Alert>
      ) : (
        <Panel title="Your answer">
          <MeetingChoice value={meetingId} onChange={setMeetingId} error={accept.error?.fields.meetingId} />
          {accept.isError ? (
            <p role="alert" className="font-semibold text-madder-deep">
              <span aria-hidden="true">✗ </span>
              {accept.error.message}
            </p>
          ) : null}
          <div className="flex flex-col gap-3 sm:flex-row">
            <Button onClick={() => accept.mutate({ offerId: offer.id, data: meetingId ? { meetingId } : {} })} isPending={accept.isPending} pendingLabel="Accepting…" disabled={decline.isPending}>
              Accept this bundle
            </Button>
            <Button variant="secondary" onClick={() => setConfirmDecline(true)} disabled={accept.isPending}>
              Pass it on
            </Button>
          </div>
        </Panel>
      )}

      <ConfirmDialog
        open={confirmDecline && !ended}
        title="Pass this bundle on?"
        confirmLabel="Pass it on"
        pendingLabel="Passing it on…"
        isPending={decline.isPending}
        onCancel={() => setConfirmDecline(false)}
        onConfirm={() => decline.mutate({ offerId: offer.id })}
      >
        <p>It goes to the next person on the waiting list, and you leave the list. You can join it again from the starter page.</p>
        {decline.isError && !ended ? (
          <p role="alert" className="font-semibold text-madder-deep">
            {decline.error.message}
          </p>
        ) : null}
      </ConfirmDialog>
    </>
  );
}

function AnswerResult({ answer }: { answer: Answer }) {
  const timeZone = useGuildTimeZone();
  const meetings = useMeetings('upcoming');
  const meeting = answer.kind === 'accepted' ? meetings.data?.items.find((m) => m.id === answer.meetingId) : undefined;
  return (
    <>
      {answer.kind === 'accepted' ? (
        <Alert tone="success" title={`“${answer.title}” is yours`}>
          <p>
            {meeting
              ? `Collect it at the meeting on ${formatDateTime(meeting.startsAt, timeZone)}, ${meeting.place}.`
              : 'No guild meeting is set yet: it is held for you until the guild sets its next meeting.'}{' '}
            We have sent you an e-mail with the details.
          </p>
        </Alert>
      ) : (
        <Alert tone="success" title="Passed on">
          <p>“{answer.title}” goes to the next person on the waiting list. You have left the list; join again from the starter page whenever you like.</p>
        </Alert>
      )}
      <ButtonLink to={paths.app.starter.getHref()} variant="secondary">
        Back to the starter programme
      </ButtonLink>
    </>
  );
}
