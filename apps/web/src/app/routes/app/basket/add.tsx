import { useEffect } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { paths } from '../../../../config/paths.ts';
import { Loading } from '../../../../components/ui/loading.tsx';
import { useSessionUser } from '../../../../features/auth/api/get-session.ts';
import { isBundleId, updateBasket, withItem } from '../../../../lib/basket-store.ts';

/**
 * `/basket/add/:id` (from a bundle page's button or a shared link): puts the
 * bundle in this member's basket and shows the basket. Adding is idempotent, so
 * a reload or a second tap does not add a second copy.
 */
export function Component() {
  const user = useSessionUser();
  const { id } = useParams();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const quantity = Number(search.get('quantity') ?? '1');

  useEffect(() => {
    const valid = isBundleId(id);
    if (valid) updateBasket((basket) => withItem(basket, user.id, id, Number.isInteger(quantity) && quantity > 0 ? quantity : 1));
    navigate(paths.app.basket.getHref(), { replace: true, state: valid ? { added: id } : null });
  }, [id, quantity, user.id, navigate]);

  return <Loading label="Adding it to your basket…" />;
}
