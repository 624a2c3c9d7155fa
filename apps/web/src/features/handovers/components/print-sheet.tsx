import type { MeetingView } from '@scrap-relay/shared';
import { cn } from '../../../utils/cn.ts';
import { formatDateTime } from '../../../utils/meetings.ts';
import { groupHandovers } from '../handover-groups.ts';
import type { HandoverView } from '@scrap-relay/shared';
import { HandoverItems, handoverName } from './handover-items.tsx';
import { QrCode } from './qr-code.tsx';

/** An empty square to tick by pen; drawn with a border so it prints in black and white. */
function PenTick({ done }: { done: boolean }) {
  return (
    <span aria-hidden="true" className="inline-flex size-[7mm] shrink-0 items-center justify-center border-2 border-black text-lg font-bold leading-none">
      {done ? '✓' : ''}
    </span>
  );
}

/**
 * The paper sheet: one page per member who brings bundles (a page break between them,
 * so each giver's page can be handed to them), each handover with its QR code and a box
 * to tick by pen; then one list by who collects. Shown only when printing.
 */
/** `timeZone`: the guild's, so the printed sheet reads the meeting's time as the e-mails do. */
export function PrintSheet({ meeting, items, timeZone }: { meeting: MeetingView; items: HandoverView[]; timeZone: string }) {
  const byGiver = groupHandovers(items, 'giver');
  const byCollector = groupHandovers(items, 'collector');
  const title = `${formatDateTime(meeting.startsAt, timeZone)} — ${meeting.place}`;

  if (items.length === 0) {
    return (
      <div className="hidden print:block">
        <p>Nothing is due at this meeting.</p>
      </div>
    );
  }

  return (
    <div className="hidden text-black print:block" data-print-sheet="">
      {byGiver.map((group, index) => (
        <section key={group.person.id || group.person.name} className={cn('space-y-3', index > 0 && 'break-before-page')}>
          <div className="border-b-2 border-black pb-1">
            <p className="text-sm">Handover sheet · {title}</p>
            <h2 className="text-xl font-bold">
              {group.person.name} brings {group.handovers.length === 1 ? '1 handover' : `${group.handovers.length} handovers`}
            </h2>
          </div>
          <table className="w-full border-collapse text-left">
            <thead>
              <tr className="border-b border-black">
                <th scope="col" className="w-[10mm] py-1 pr-2">Done</th>
                <th scope="col" className="py-1 pr-2">To</th>
                <th scope="col" className="py-1 pr-2">Bundles</th>
                <th scope="col" className="w-[30mm] py-1">Scan to tick</th>
              </tr>
            </thead>
            <tbody>
              {group.handovers.map((handover) => (
                <tr key={handover.id} className="break-inside-avoid border-b border-black align-top">
                  <td className="py-2 pr-2">
                    <PenTick done={handover.done} />
                  </td>
                  <td className="py-2 pr-2">
                    <p className="font-bold">{handover.collector.name}</p>
                    <p>
                      {handoverName(handover)}
                    </p>
                    {handover.done && handover.doneBy ? <p>Ticked by {handover.doneBy}</p> : null}
                  </td>
                  <td className="py-2 pr-2">
                    <HandoverItems items={handover.items} size="print" />
                  </td>
                  <td className="py-2">
                    <QrCode svg={handover.qrSvg} label={`QR code for ${handover.reference}`} className="size-[28mm]" />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}

      <section className="break-before-page space-y-3">
        <div className="border-b-2 border-black pb-1">
          <p className="text-sm">Handover sheet · {title}</p>
          <h2 className="text-xl font-bold">Who collects what</h2>
        </div>
        <table className="w-full border-collapse text-left">
          <thead>
            <tr className="border-b border-black">
              <th scope="col" className="w-[10mm] py-1 pr-2">Done</th>
              <th scope="col" className="py-1 pr-2">Collector</th>
              <th scope="col" className="py-1 pr-2">Reference</th>
              <th scope="col" className="py-1 pr-2">From</th>
              <th scope="col" className="py-1">Bundles</th>
            </tr>
          </thead>
          <tbody>
            {/* The collector's name on every row: a page break may fall between one person's rows, and the door reads one row at a time. */}
            {byCollector.flatMap((group) =>
              group.handovers.map((handover, index) => (
                <tr key={handover.id} className={cn('break-inside-avoid border-b border-black align-top', index === 0 && 'border-t-2')}>
                  <td className="py-1 pr-2">
                    <PenTick done={handover.done} />
                  </td>
                  <td className="py-1 pr-2 font-bold">{group.person.name}</td>
                  <td className="py-1 pr-2">{handover.reference}</td>
                  <td className="py-1 pr-2">{handover.giver.name}</td>
                  <td className="py-1">{handover.items.map((item) => (item.quantity > 1 ? `${item.title} × ${item.quantity}` : item.title)).join('; ')}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      </section>
    </div>
  );
}
