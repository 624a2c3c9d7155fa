import { useParams, useSearchParams } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Page } from '../../../../components/layouts/page.tsx';
import { Alert } from '../../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../../components/ui/button.tsx';
import { Loading } from '../../../../components/ui/loading.tsx';
import { isApiError } from '../../../../lib/api-client.ts';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { OrderDetails } from '../../../../features/orders/components/order-details.tsx';
import { useOrderAfterPayment } from '../../../../features/orders/hooks/use-order-after-payment.ts';

/** `/orders/:id`; the payment page returns here with `?paid=<session id>`. */
export function Component() {
  const { id = '' } = useParams();
  const [search] = useSearchParams();
  const user = useSessionUser();
  const { query, payment } = useOrderAfterPayment(id, search.get('paid'));

  if (query.isPending) return <Loading label="Loading the order…" />;
  if (query.isError) {
    const missing = isApiError(query.error) && (query.error.status === 404 || query.error.status === 403);
    return (
      <Page title={missing ? 'Order not found' : 'The order could not be loaded'} width="narrow">
        <Alert tone="error" title={missing ? 'There is no such order on your account.' : query.error.message}>
          {missing ? null : (
            <Button variant="secondary" onClick={() => query.refetch()}>
              Try again
            </Button>
          )}
        </Alert>
        <ButtonLink to={paths.app.orders.getHref()} variant="secondary">
          Your orders
        </ButtonLink>
      </Page>
    );
  }

  const { order } = query.data;
  return (
    <Page title={`Order ${order.reference}`} intro={order.viewerIs === 'buyer' ? `From ${order.seller.name}` : `To ${order.buyer.name}`}>
      <OrderDetails order={order} units={user.units} payment={payment} />
    </Page>
  );
}
