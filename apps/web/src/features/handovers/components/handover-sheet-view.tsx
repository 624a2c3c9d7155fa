import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { paths } from '../../../config/paths.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { formatMeetingWhen, meetingHasStarted } from '../../../utils/meetings.ts';
import { useHandoverSheet } from '../api/get-handover-sheet.ts';
import { sheetProgress } from '../handover-groups.ts';
import type { HandoverSheet } from '../types.ts';
import { AfterMeeting } from './after-meeting.tsx';
import { DoorChecklist } from './door-checklist.tsx';
import { PrintSheet } from './print-sheet.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

/** A meeting's handover sheet: progress, the door checklist, what was missed afterwards, and the print layout. */
export function HandoverSheetView({ meetingId, viewerName }: { meetingId: string; viewerName: string }) {
  const sheet = useHandoverSheet(meetingId);
  if (sheet.isPending) return <Loading label="Loading the handover sheet…" />;
  if (sheet.isError) {
    const status = isApiError(sheet.error) ? sheet.error.status : 0;
    if (status === 403) {
      return <Alert tone="info" title="Handover sheets are for the librarians and admins who run meetings" />;
    }
    return (
      <Alert tone="error" title="The handover sheet could not be loaded">
        <p>{sheet.error.message}</p>
        {status !== 404 ? (
          <Button variant="secondary" onClick={() => sheet.refetch()}>
            Try again
          </Button>
        ) : null}
      </Alert>
    );
  }
  return <SheetContent sheet={sheet.data} viewerName={viewerName} />;
}

function SheetContent({ sheet, viewerName }: { sheet: HandoverSheet; viewerName: string }) {
  const timeZone = useGuildTimeZone();
  const progress = sheetProgress(sheet.items);
  const started = meetingHasStarted(sheet.meeting);
  return (
    <div className="space-y-8">
      <p className="text-xl print:hidden">
        <strong>{formatMeetingWhen(sheet.meeting.startsAt, timeZone)}</strong>, {sheet.meeting.place}
        {started ? <span className="block text-lg text-thread-soft">This meeting has started.</span> : null}
      </p>
      <div className="flex flex-wrap items-center justify-between gap-4 print:hidden">
        <p role="status" className="text-lg font-semibold">
          {progress.total === 0
            ? 'Nothing is due at this meeting yet.'
            : `${progress.done} of ${progress.total} handed over${progress.open > 0 ? `, ${progress.open} still to do` : ' — all done'}.`}
        </p>
        <div className="flex flex-wrap gap-3">
          <Button variant="secondary" onClick={() => window.print()}>
            Print the sheet
          </Button>
          <Link to={paths.app.meetings.getHref()} className="inline-flex min-h-11 items-center font-semibold">
            All meetings
          </Link>
        </div>
      </div>
      {started ? <AfterMeeting meeting={sheet.meeting} open={sheet.items.filter((h) => !h.done)} /> : null}
      <DoorChecklist items={sheet.items} meetingId={sheet.meeting.id} viewerName={viewerName} />
      <PrintSheet meeting={sheet.meeting} items={sheet.items} timeZone={timeZone} />
    </div>
  );
}
