import { Button } from '../../../components/ui/button.tsx';
import { cn } from '../../../utils/cn.ts';
import { formatShortDateTime } from '../../../utils/meetings.ts';
import { useMarkHandover } from '../api/mark-handover.ts';
import type { HandoverView } from '@scrap-relay/shared';
import { HandoverItems, handoverName } from './handover-items.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

export interface HandoverCardProps {
  handover: HandoverView;
  meetingId: string;
  viewerName: string;
  /** "h4" inside a person's group on the sheet; "h2" on the single check-off page. */
  headingLevel?: 'h2' | 'h4';
}

/**
 * One handover at the door: who to whom, what, and a big tick (or undo) sized for
 * a thumb on a phone. Shows who ticked it and when.
 */
export function HandoverCard({ handover, meetingId, viewerName, headingLevel = 'h4' }: HandoverCardProps) {
  const timeZone = useGuildTimeZone();
  const mark = useMarkHandover(meetingId, viewerName);
  const Heading = headingLevel;
  const pendingFor = mark.isPending ? mark.variables.done : null;
  return (
    <article
      aria-label={`${handover.reference}: ${handover.giver.name} to ${handover.collector.name}`}
      className={cn('space-y-3 rounded-stitch border-2 p-4', handover.done ? 'border-sage bg-sage-wash' : 'border-seam bg-muslin')}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-4">
        <Heading className="text-lg font-bold">
          {handover.giver.name} <span aria-hidden="true">→</span>
          <span className="sr-only"> to </span> {handover.collector.name}
        </Heading>
        <p className="text-thread-soft">
          {handoverName(handover)}
        </p>
      </div>
      <HandoverItems items={handover.items} />
      <p role="status" className={cn('font-semibold', handover.done ? 'text-sage' : 'text-thread-soft')}>
        {handover.done ? (
          <>
            <span aria-hidden="true">✓ </span>Handed over{handover.doneBy ? ` — ticked by ${handover.doneBy}` : ''}
            {handover.doneAt ? ` at ${formatShortDateTime(handover.doneAt, timeZone)}` : ''}
          </>
        ) : (
          'Not handed over yet'
        )}
      </p>
      <div className="flex flex-col gap-3 sm:flex-row">
        {handover.abilities.markDone ? (
          <Button
            onClick={() => mark.mutate({ handoverId: handover.id, done: true })}
            isPending={pendingFor === true}
            pendingLabel="Ticking…"
            className="min-h-14 w-full text-lg sm:w-auto sm:min-w-56"
          >
            <span aria-hidden="true" className="text-2xl leading-none">
              ✓
            </span>
            Handed over<span className="sr-only">: {handover.reference}</span>
          </Button>
        ) : null}
        {handover.abilities.undo ? (
          <Button variant="secondary" onClick={() => mark.mutate({ handoverId: handover.id, done: false })} isPending={pendingFor === false} pendingLabel="Undoing…">
            Undo the tick<span className="sr-only">: {handover.reference}</span>
          </Button>
        ) : null}
      </div>
      {handover.done && handover.undoNote ? <p className="text-thread-soft">{handover.undoNote}</p> : null}
      {mark.isError ? (
        <p role="alert" className="font-semibold text-madder-deep">
          <span aria-hidden="true">✗ </span>
          {mark.error.message}
        </p>
      ) : null}
    </article>
  );
}
