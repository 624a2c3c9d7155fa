import { useSearchParams } from 'react-router-dom';
import { Page } from '../../../../components/layouts/page.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import type { OrderSide } from '../../../../features/orders/api/get-orders.ts';
import { OrderSideSwitch, OrdersList } from '../../../../features/orders/components/orders-list.tsx';

export function Component() {
  const user = useSessionUser();
  const [search] = useSearchParams();
  const side: OrderSide = search.get('as') === 'seller' ? 'seller' : 'buyer';
  return (
    <Page title="Orders" intro="Everything you have bought or been given, and everything of yours that found a new home.">
      <OrderSideSwitch side={side} />
      <OrdersList side={side} claimsStarter={user.abilities.claimStarter} />
    </Page>
  );
}
