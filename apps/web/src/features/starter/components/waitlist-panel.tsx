import { useState } from 'react';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useJoinWaitlist } from '../api/join-waitlist.ts';
import { useLeaveWaitlist } from '../api/leave-waitlist.ts';
import type { StarterStatus } from '../types.ts';

const placeText = (position: number) => (position === 1 ? 'You are next in line.' : `You are number ${position} in the queue.`);

/**
 * The member's side of the waiting list: join when nothing is free, see their place,
 * leave. Shown only when it applies (eligible and nothing free, or already queued).
 */
export function WaitlistPanel({ status, freeCount }: { status: StarterStatus; freeCount: number }) {
  const [confirmLeave, setConfirmLeave] = useState(false);
  const join = useJoinWaitlist();
  const leave = useLeaveWaitlist({ onSuccess: () => setConfirmLeave(false) });
  const entry = status.waitlist;
  const timeZone = useGuildTimeZone();

  if (entry) {
    return (
      <Panel title="Your place on the waiting list">
        <p className="text-lg">
          <strong>{placeText(entry.position)}</strong> You joined on {formatDate(entry.joinedAt, timeZone)}.
        </p>
        <p>When a starter bundle comes in, it is offered to the person at the front of the queue by e-mail, with a few days to answer.</p>
        {join.isSuccess ? <Alert tone="success" title="You are on the waiting list" /> : null}
        <Button variant="secondary" onClick={() => setConfirmLeave(true)}>
          Leave the waiting list
        </Button>
        <ConfirmDialog
          open={confirmLeave}
          title="Leave the waiting list?"
          confirmLabel="Leave the list"
          pendingLabel="Leaving…"
          confirmVariant="danger"
          isPending={leave.isPending}
          onCancel={() => setConfirmLeave(false)}
          onConfirm={() => leave.mutate()}
        >
          <p>You lose your place in the queue{status.offer ? ', and the bundle offered to you goes to the next person' : ''}. You can join again later, at the back.</p>
          {leave.isError ? (
            <p role="alert" className="font-semibold text-madder-deep">
              {leave.error.message}
            </p>
          ) : null}
        </ConfirmDialog>
      </Panel>
    );
  }

  if (!status.eligibility.eligible || freeCount > 0) {
    return leave.isSuccess ? <Alert tone="success" title="You have left the waiting list" /> : null;
  }

  return (
    <Panel title="None free just now">
      <p>
        Every starter bundle has been claimed. Join the waiting list and the next one that comes in is offered to you when it is your turn — by
        e-mail, with a few days to accept it or pass it on.
      </p>
      {leave.isSuccess ? <Alert tone="success" title="You have left the waiting list" /> : null}
      {join.isError ? (
        <Alert tone="error" title={join.error.message}>
          {join.error.status === 409 ? <p>The list below has been brought up to date.</p> : null}
        </Alert>
      ) : null}
      <Button onClick={() => join.mutate()} isPending={join.isPending} pendingLabel="Joining…">
        Join the waiting list
      </Button>
    </Panel>
  );
}
