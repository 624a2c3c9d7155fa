import { useLocation } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSession, useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { BasketView } from '../../../../features/checkout/components/basket-view.tsx';
import { isBundleId } from '../../../../lib/basket-store.ts';

export function Component() {
  const user = useSessionUser();
  const guild = useSession().data?.guild;
  const state = useLocation().state as { added?: unknown; notAdded?: unknown } | null;
  return (
    <Page title="Your basket" intro="Bundles you mean to buy or ask for. Each member’s bundles check out together as one order.">
      <BasketView
        member={{ id: user.id, units: user.units, emailVerified: user.emailVerified }}
        guild={{ name: guild?.name ?? 'The guild', currency: guild?.currency ?? 'USD' }}
        addedBundleId={isBundleId(state?.added) ? state.added : null}
        notAdded={typeof state?.notAdded === 'string' ? state.notAdded : null}
      />
    </Page>
  );
}
