import type { ShelfFilters, WishView } from '@scrap-relay/shared';
import { useMemo } from 'react';
import { useWishes } from '../api/get-wishes.ts';
import { wishWithFilters } from '../utils/same-filters.ts';

/** The member's wish with exactly these filters, if any (`known` is false until the wishes have loaded). */
export function useSavedWish(filters: ShelfFilters): { savedWish: WishView | undefined; known: boolean } {
  const wishes = useWishes();
  const savedWish = useMemo(() => (wishes.data ? wishWithFilters(wishes.data.items, filters) : undefined), [wishes.data, filters]);
  return { savedWish, known: wishes.isSuccess };
}
