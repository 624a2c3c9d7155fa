import { Page } from '../../../../components/layouts/page.tsx';
import { SellerBalancesView } from '../../../../features/treasurer/components/seller-balances-view.tsx';

export function Component() {
  return (
    <Page
      title="Seller balances"
      width="wide"
      intro="What the guild owes each seller: their share of sales and the postage they paid, less refunds and payouts already made."
    >
      <SellerBalancesView />
    </Page>
  );
}
