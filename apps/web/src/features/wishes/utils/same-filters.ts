import { parseShelfFilters, type ShelfFilters, shelfSearchParams, type WishView } from '@scrap-relay/shared';

/** The filters as the shelf's address writes them: fixed key order, empty ones left out, numbers as text. */
const filtersKey = (filters: ShelfFilters): string => shelfSearchParams({ filters }).toString();

/** The member's wish that asks for exactly these filters (as the API refuses a second one with a 409), if any. */
export function wishWithFilters(wishes: readonly WishView[], filters: ShelfFilters): WishView | undefined {
  const wanted = filtersKey(filters);
  if (wanted === '') return undefined;
  return wishes.find((wish) => filtersKey(parseShelfFilters((key) => wish.filters[key])) === wanted);
}
