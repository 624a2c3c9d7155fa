import type { MeetingView } from '@scrap-relay/shared';
import { useState } from 'react';
import { MeetingSelect } from '../../../components/meeting-select.tsx';
import { Panel } from '../../../components/layouts/page.tsx';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog } from '../../../components/ui/dialog.tsx';
import { useMeetings } from '../../../lib/meetings.ts';
import { meetingLabel } from '../../../utils/meetings.ts';
import { useCancelHandover } from '../api/cancel-handover.ts';
import { useMoveHandovers } from '../api/move-handovers.ts';
import type { HandoverView } from '@scrap-relay/shared';
import { HandoverItems, handoverName } from './handover-items.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

/**
 * After the meeting: what did not change hands. Move it all to another meeting
 * (both people are e-mailed), or cancel single handovers (paid orders are refunded).
 */
export function AfterMeeting({ meeting, open }: { meeting: MeetingView; open: HandoverView[] }) {
  const [moved, setMoved] = useState<string | null>(null);
  const [cancelled, setCancelled] = useState<string | null>(null);
  const [cancelling, setCancelling] = useState<HandoverView | null>(null);

  return (
    <Panel title="Not handed over" className="print:hidden">
      {moved ? <Alert tone="success" title={moved} /> : null}
      {cancelled ? <Alert tone="success" title={cancelled} /> : null}
      {open.length === 0 ? (
        <p>Everything on this sheet was handed over.</p>
      ) : (
        <>
          <p>
            {open.length === 1 ? 'One handover was' : `${open.length} handovers were`} not ticked at this meeting. Move them to another meeting, or cancel
            the ones that will not happen.
          </p>
          <MoveAll meeting={meeting} count={open.length} onMoved={setMoved} />
          <ul className="divide-y-2 divide-seam">
            {open.map((handover) => (
              <li key={handover.id} className="flex flex-col gap-3 py-3 sm:flex-row sm:items-start sm:justify-between">
                <div className="space-y-2">
                  <p className="font-semibold">
                    {handover.giver.name} → {handover.collector.name} · {handoverName(handover)}
                  </p>
                  <HandoverItems items={handover.items} />
                </div>
                {handover.abilities.cancel ? (
                  <Button variant="secondary" onClick={() => setCancelling(handover)} className="shrink-0">
                    Cancel<span className="sr-only"> {handover.reference}</span>
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        </>
      )}
      {cancelling ? (
        <CancelDialog
          handover={cancelling}
          onClose={() => setCancelling(null)}
          onCancelled={(h) => {
            setCancelling(null);
            setCancelled(`${h.reference} is cancelled.`);
          }}
        />
      ) : null}
    </Panel>
  );
}

function MoveAll({ meeting, count, onMoved }: { meeting: MeetingView; count: number; onMoved: (message: string) => void }) {
  const timeZone = useGuildTimeZone();
  const upcoming = useMeetings('upcoming');
  const targets = (upcoming.data?.items ?? []).filter((m) => m.id !== meeting.id);
  const [chosen, setChosen] = useState('');
  const move = useMoveHandovers();
  const target = targets.find((m) => m.id === chosen) ?? targets[0];

  if (upcoming.isSuccess && targets.length === 0) {
    return <p className="font-semibold">No later meeting is set yet. Add one on the meetings page, then move these to it.</p>;
  }
  return (
    <div className="space-y-3 rounded-stitch border-2 border-seam bg-linen p-4">
      <MeetingSelect
        label="Move to"
        meetings={targets}
        value={target?.id ?? ''}
        onChange={setChosen}
        disabled={!upcoming.isSuccess}
        error={move.error?.fields.toMeetingId}
      />
      <Button
        disabled={!target}
        isPending={move.isPending}
        pendingLabel="Moving…"
        onClick={() =>
          target &&
          move.mutate(
            { meetingId: meeting.id, data: { toMeetingId: target.id } },
            { onSuccess: ({ moved }) => onMoved(`Moved ${moved === 1 ? '1 handover' : `${moved} handovers`} to ${meetingLabel(target, timeZone)}. Both people in each were e-mailed.`) },
          )
        }
      >
        {`${count === 1 ? 'Move it' : `Move all ${count}`} to ${target && target.id !== targets[0]?.id ? 'the chosen meeting' : 'the next meeting'}`}
      </Button>
      {move.isError && !move.error.fields.toMeetingId ? (
        <p role="alert" className="font-semibold text-madder-deep">
          {move.error.message}
        </p>
      ) : null}
    </div>
  );
}

function CancelDialog({ handover, onClose, onCancelled }: { handover: HandoverView; onClose: () => void; onCancelled: (h: HandoverView) => void }) {
  const cancel = useCancelHandover({ onSuccess: () => onCancelled(handover) });
  return (
    <ConfirmDialog
      open
      title={`Cancel ${handover.reference}?`}
      confirmLabel="Cancel the handover"
      cancelLabel="Keep it"
      pendingLabel="Cancelling…"
      confirmVariant="danger"
      isPending={cancel.isPending}
      onCancel={onClose}
      onConfirm={() => cancel.mutate({ handoverId: handover.id })}
    >
      {handover.kind === 'order' ? (
        <p>
          The order from {handover.giver.name} to {handover.collector.name} is cancelled. <strong>If it was paid for, the buyer is refunded</strong>, as
          the guild’s rules and local law require, and both members are told.
        </p>
      ) : (
        <p>
          {handover.collector.name}’s claim is cancelled and the starter bundle goes back to the programme: it is offered to the next new quilter
          waiting.
        </p>
      )}
      {cancel.isError ? (
        <p role="alert" className="font-semibold text-madder-deep">
          {cancel.error.message}
        </p>
      ) : null}
    </ConfirmDialog>
  );
}
