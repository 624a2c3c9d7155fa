import { useEffect, useState } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { BasketView } from '../../../../features/checkout/components/basket-view.tsx';
import { isBundleId } from '../../../../lib/basket-store.ts';

interface ArrivedFrom {
  added?: unknown;
  notAdded?: unknown;
}

export function Component() {
  const user = useSessionUser();
  const guild = useSession().data?.guild;
  const location = useLocation();
  const navigate = useNavigate();
  // What the add link reports is shown for this visit only: the history entry forgets it, so a reload does not repeat it.
  const [arrived] = useState(() => (location.state ?? null) as ArrivedFrom | null);
  useEffect(() => {
    if (location.state) navigate(`${location.pathname}${location.search}`, { replace: true, state: null });
  }, [location.state, location.pathname, location.search, navigate]);
  return (
    <Page title="Your basket" intro="Bundles you mean to buy or ask for. Each member’s bundles check out together as one order.">
      <BasketView
        member={{ id: user.id, units: user.units, emailVerified: user.emailVerified }}
        guild={{ name: guild?.name ?? 'The guild', currency: guild?.currency ?? 'USD' }}
        addedBundleId={isBundleId(arrived?.added) ? arrived.added : null}
        notAdded={typeof arrived?.notAdded === 'string' ? arrived.notAdded : null}
      />
    </Page>
  );
}
