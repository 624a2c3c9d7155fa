import { useParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { PrintFrame } from '../../../../components/print-frame.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { HandoverSheetView } from '../../../../features/handovers/components/handover-sheet-view.tsx';

export function Component() {
  const user = useSessionUser();
  const { meetingId = '' } = useParams();
  return (
    <PrintFrame>
      <Page
        title="Handover sheet"
        // The sheet on paper has its own headings; how to use the screen is not printed.
        intro={<span className="print:hidden">Who brings what to whom at this meeting. Tick each handover at the door, or print the sheet.</span>}
        width="wide"
      >
        <HandoverSheetView meetingId={meetingId} viewerName={user.name} />
      </Page>
    </PrintFrame>
  );
}
