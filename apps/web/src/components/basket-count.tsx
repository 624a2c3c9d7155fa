import { useBasketCount } from '../lib/basket-store.ts';
import { useSignedInMemberId } from '../utils/guild-session.ts';

/** The number beside "Basket" in the menu; nothing when the basket is empty. */
export function BasketCount() {
  const count = useBasketCount(useSignedInMemberId());
  if (count === 0) return null;
  return (
    <span className="ml-2 inline-flex min-w-7 items-center justify-center rounded-full bg-madder px-2 text-sm font-bold leading-6 text-white">
      {count}
      <span className="sr-only"> {count === 1 ? 'bundle' : 'bundles'}</span>
    </span>
  );
}
