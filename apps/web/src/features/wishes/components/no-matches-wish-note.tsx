import type { ShelfFilters } from '@scrap-relay/shared';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { useSavedWish } from '../hooks/use-saved-wish.ts';

/**
 * The shelf's words when its filters match nothing: save them as a wish, or, when they already are one of the
 * member's wishes, that an e-mail will come, without offering to save them again.
 */
export function NoMatchesWishNote({ filters }: { filters: ShelfFilters }) {
  const { savedWish, known } = useSavedWish(filters);
  if (!known) return <p>Try fewer filters.</p>;
  if (savedWish) {
    return (
      <p>
        Try fewer filters. These are already your wish “{savedWish.name}”: you will hear by e-mail when a bundle like this is approved.{' '}
        <Link to={paths.app.wishes.getHref()}>See your wishes</Link>
      </p>
    );
  }
  return <p>Try fewer filters, or save these as a wish (the button under the filters): you will hear by e-mail when a bundle like this is approved.</p>;
}
