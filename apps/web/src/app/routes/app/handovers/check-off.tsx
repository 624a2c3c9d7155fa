import { useParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { HandoverCheckOff } from '../../../../features/handovers/components/handover-check-off.tsx';

export function Component() {
  const user = useSessionUser();
  const { handoverId = '' } = useParams();
  return (
    <Page title="Check off a handover" intro="Opened from the QR code on the handover sheet." width="narrow">
      <HandoverCheckOff handoverId={handoverId} viewerName={user.name} />
    </Page>
  );
}
