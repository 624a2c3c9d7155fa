import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { paths } from '../../../config/paths.ts';
import { isApiError } from '../../../lib/api-client.ts';
import { formatDateTime } from '../../../utils/meetings.ts';
import { useHandoverMeetingId } from '../api/find-handover.ts';
import { useHandoverSheet } from '../api/get-handover-sheet.ts';
import { HandoverCard } from './handover-card.tsx';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';

/** One handover, opened by scanning its QR code at the door: the details and a big "Handed over" button. */
export function HandoverCheckOff({ handoverId, viewerName }: { handoverId: string; viewerName: string }) {
  const timeZone = useGuildTimeZone();
  const found = useHandoverMeetingId(handoverId);
  const sheet = useHandoverSheet(found.data);

  if (found.isPending || (found.isSuccess && sheet.isPending)) return <Loading label="Finding this handover…" />;
  const error = found.error ?? sheet.error;
  if (error) {
    const status = isApiError(error) ? error.status : 0;
    if (status === 403) return <Alert tone="info" title="Only the librarians and admins who run meetings can tick handovers" />;
    return (
      <Alert tone="error" title="This handover could not be found">
        <p>{error.message}</p>
        {status !== 404 ? (
          <Button variant="secondary" onClick={() => void (found.isError ? found.refetch() : sheet.refetch())}>
            Try again
          </Button>
        ) : null}
      </Alert>
    );
  }
  const handover = sheet.data?.items.find((h) => h.id === handoverId);
  if (!sheet.data || !handover) {
    return <Alert tone="info" title="This handover is no longer on its meeting’s sheet. It may have been moved or cancelled." />;
  }
  return (
    <div className="space-y-6">
      <p className="text-lg">
        At the meeting on <strong>{formatDateTime(sheet.data.meeting.startsAt, timeZone)}</strong>, {sheet.data.meeting.place}.
      </p>
      <HandoverCard handover={handover} meetingId={sheet.data.meeting.id} viewerName={viewerName} headingLevel="h2" />
      <ButtonLink to={paths.app.handoverSheet.getHref(sheet.data.meeting.id)} variant="secondary">
        Open the whole sheet
      </ButtonLink>
    </div>
  );
}
