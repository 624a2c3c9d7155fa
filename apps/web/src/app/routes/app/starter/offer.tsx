import { useParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { StarterOffer } from '../../../../features/starter/components/starter-offer.tsx';

export function Component() {
  const user = useSessionUser();
  const { offerId = '' } = useParams();
  return (
    <Page title="A starter bundle for you" intro="You reached the front of the waiting list. Accept the bundle, or pass it on to the next person." width="regular">
      <StarterOffer offerId={offerId} units={user.units} />
    </Page>
  );
}
