import type { NavCountProps } from '../config/nav.ts';
import { useBasketCount } from '../lib/basket-store.ts';
import { useSignedInMemberId } from '../utils/guild-session.ts';

/**
 * The number beside "Basket" in the menu, and on the phone's Menu button while the menu
 * is folded away; nothing when the basket is empty.
 */
export function BasketCount({ onMenuButton = false }: NavCountProps) {
  const count = useBasketCount(useSignedInMemberId());
  if (count === 0) return null;
  const counted = count === 1 ? 'bundle' : 'bundles';
  return (
    // The Menu button spaces its own contents; beside a link's label the badge keeps its distance itself.
    <span className={`${onMenuButton ? '' : 'ml-2 '}inline-flex min-w-7 items-center justify-center rounded-full bg-madder px-2 text-sm font-bold leading-6 text-white`}>
      {count}
      <span className="sr-only">{` ${counted}${onMenuButton ? ' in your basket' : ''}`}</span>
    </span>
  );
}
