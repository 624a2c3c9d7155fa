import { useEffect } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Loading } from '../../../../components/ui/loading.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { isApiError } from '../../../../lib/api-client.ts';
import { isBundleId, MAX_BASKET_QUANTITY, useBasketChanges } from '../../../../lib/basket-store.ts';

/**
 * `/basket/add/:id` (from a bundle page's button or a shared link): puts the
 * bundle in this member's basket and shows the basket. Adding is idempotent, so
 * a reload or a second tap does not add a second copy. A bundle the basket
 * cannot take (gone from the shelf, the member's own) is named on the basket
 * page with the server's reason.
 */
export function Component() {
  const user = useSessionUser();
  const { id } = useParams();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const { mutateAsync: add } = useBasketChanges(user.id).add;
  const asked = Number(search.get('quantity') ?? '1');
  const quantity = Number.isInteger(asked) && asked > 0 ? Math.min(asked, MAX_BASKET_QUANTITY) : 1;

  useEffect(() => {
    const basket = paths.app.basket.getHref();
    if (!isBundleId(id)) {
      navigate(basket, { replace: true, state: { notAdded: 'That link does not name a bundle.' } });
      return;
    }
    add({ bundleId: id, quantity }).then(
      () => navigate(basket, { replace: true, state: { added: id } }),
      (error: unknown) =>
        navigate(basket, { replace: true, state: { notAdded: isApiError(error) ? error.message : 'Scrap Relay did not answer. Try the bundle’s page again.' } }),
    );
  }, [id, quantity, add, navigate]);

  return <Loading label="Adding it to your basket…" />;
}
