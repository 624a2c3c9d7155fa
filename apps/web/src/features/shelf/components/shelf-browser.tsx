import { countFilters, type ShelfFilters, type ShelfPage, shelfQueryFor, type ShelfSort, type UnitSystem } from '@scrap-relay/shared';
import { lazy, Suspense, useEffect, useId, useRef, useState, type ReactNode, type RefObject } from 'react';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button, ButtonLink } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { cn } from '../../../utils/cn.ts';
import { useShelf } from '../api/get-shelf.ts';
import { useShelfSearch } from '../hooks/use-shelf-search.ts';
import { BundleCard, type CardPhotoLoading } from './bundle-card.tsx';

// The form (react-hook-form and the shared schemas) loads after the first photos (useFirstPhotosSettled), so the first paint is the shelf itself.
const ShelfFiltersForm = lazy(() => import('./shelf-filters-form.tsx').then((m) => ({ default: m.ShelfFiltersForm })));

/** The most cards in a row (three on wide screens): that many photos load at once, the rest lazily. */
const FIRST_ROW = 3;
const cardPhotoLoading = (index: number): CardPhotoLoading => (index === 0 ? 'first' : index < FIRST_ROW ? 'eager' : 'lazy');
/** How long the filters wait for the first photos at most, so a stalled photo never keeps them away. */
const PHOTO_WAIT_MS = 3_000;

/**
 * True once the shelf has answered and the photos it shows at once have arrived or failed (or PHOTO_WAIT_MS has
 * passed): what loads then (the filter form, the wish panel, ~45 kB with their libraries) does not share a slow
 * link with the page's largest paint. Stays true.
 */
function useFirstPhotosSettled(results: RefObject<HTMLElement | null>, answered: boolean): [boolean, () => void] {
  const [settled, setSettled] = useState(false);
  useEffect(() => {
    if (settled || !answered) return;
    const settle = () => setSettled(true);
    const waiting = [...(results.current?.querySelectorAll<HTMLImageElement>('img:not([loading="lazy"])') ?? [])].filter((img) => !img.complete);
    if (waiting.length === 0) {
      settle();
      return;
    }
    let left = waiting.length;
    const onePhoto = () => {
      left -= 1;
      if (left === 0) settle();
    };
    for (const img of waiting) {
      img.addEventListener('load', onePhoto, { once: true });
      img.addEventListener('error', onePhoto, { once: true });
    }
    const timer = setTimeout(settle, PHOTO_WAIT_MS);
    return () => {
      clearTimeout(timer);
      for (const img of waiting) {
        img.removeEventListener('load', onePhoto);
        img.removeEventListener('error', onePhoto);
      }
    };
  }, [results, answered, settled]);
  return [settled, () => setSettled(true)];
}

const SORT_OPTIONS: { value: ShelfSort; label: string }[] = [
  { value: 'newest', label: 'Newest first' },
  { value: 'price_asc', label: 'Price: lowest first' },
  { value: 'price_desc', label: 'Price: highest first' },
  { value: 'weight_asc', label: 'Weight: lightest first' },
  { value: 'weight_desc', label: 'Weight: heaviest first' },
];

export interface ShelfBrowserProps {
  units: UnitSystem;
  /** The guild's currency, for the price limit. */
  currency: string;
  /** Something to offer beside the results for the filters in force (the wishes feature's "save as a wish"). */
  renderForFilters?: (filters: ShelfFilters) => ReactNode;
  /** What to suggest when the filters match nothing (the wishes feature's: save them as a wish, or that they are one). */
  renderNoMatches?: (filters: ShelfFilters) => ReactNode;
}

/** Filters (folded away on phones), sort, one page of bundle cards and the way to the next page. */
export function ShelfBrowser({ units, currency, renderForFilters, renderNoMatches }: ShelfBrowserProps) {
  const { search, setFilters, setSort, pageHref } = useShelfSearch();
  const shelf = useShelf(shelfQueryFor(search));
  const [filtersOpen, setFiltersOpen] = useState(false);
  const filtersId = useId();
  const sortId = useId();
  const resultsHeadingId = useId();
  const resultsHeading = useRef<HTMLHeadingElement>(null);
  const results = useRef<HTMLElement>(null);
  const chosen = countFilters(search.filters);
  // The filter form and the wish panel load after the first photos, or at once when a phone opens the folded filters.
  const [extrasWanted, wantExtras] = useFirstPhotosSettled(results, !shelf.isPending);

  const showResults = () => {
    setFiltersOpen(false);
    resultsHeading.current?.focus();
  };

  return (
    <div className="grid gap-6 md:grid-cols-[18rem_1fr] md:items-start">
      <div className="space-y-3">
        <Button
          variant="secondary"
          className="w-full justify-between md:hidden"
          aria-expanded={filtersOpen}
          aria-controls={filtersId}
          onClick={() => {
            wantExtras();
            setFiltersOpen((open) => !open);
          }}
        >
          <span>{chosen > 0 ? `Filters (${chosen} chosen)` : 'Filters'}</span>
          <span aria-hidden="true">{filtersOpen ? '▲' : '▼'}</span>
        </Button>
        {/* On phones the filters (and what goes with them) fold away behind the button above. */}
        <div id={filtersId} className={cn('space-y-3', !filtersOpen && 'max-md:hidden')}>
          <section
            aria-label="Filter the shelf"
            role="search"
            className="rounded-stitch border-2 border-seam bg-muslin p-4 shadow-quilt"
          >
            <h2 className="mb-4 text-xl font-bold max-md:sr-only">Filters</h2>
            {extrasWanted ? (
              <Suspense fallback={<Loading label="Loading the filters" />}>
                <ShelfFiltersForm
                  filters={search.filters}
                  units={units}
                  currency={currency}
                  onApply={(filters) => {
                    setFilters(filters);
                    showResults();
                  }}
                  onClear={() => {
                    setFilters({});
                    showResults();
                  }}
                />
              </Suspense>
            ) : (
              <Loading label="Loading the filters" />
            )}
          </section>
          {renderForFilters && extrasWanted ? renderForFilters(search.filters) : null}
        </div>
      </div>

      <section ref={results} aria-labelledby={resultsHeadingId} className="min-w-0 space-y-4">
        <h2 id={resultsHeadingId} ref={resultsHeading} tabIndex={-1} className="text-2xl font-bold focus:outline-none">
          {chosen > 0 ? 'Bundles that match' : 'Bundles on the shelf'}
        </h2>
        <div className="flex flex-wrap items-end justify-between gap-3">
          {shelf.isSuccess ? (
            <p role="status" className="font-semibold">
              {shelfStatus(shelf.data, shelf.isPlaceholderData, chosen > 0)}
            </p>
          ) : null}
          <div className="w-full sm:ml-auto sm:w-64">
            <label htmlFor={sortId} className="block font-semibold">
              Sort by
            </label>
            <Select id={sortId} options={SORT_OPTIONS} value={search.sort} onChange={(event) => setSort(event.target.value as ShelfSort)} />
          </div>
        </div>

        {shelf.isPending ? <Loading label="Loading the shelf…" /> : null}

        {shelf.isError ? (
          <Alert tone="error" title="The shelf could not be loaded">
            <p>{shelf.error.message}</p>
            <div className="flex flex-wrap gap-3">
              <Button variant="secondary" onClick={() => shelf.refetch()} isPending={shelf.isFetching} pendingLabel="Trying…">
                Try again
              </Button>
              {chosen > 0 ? (
                <Button variant="quiet" onClick={() => setFilters({})}>
                  Clear filters
                </Button>
              ) : null}
            </div>
          </Alert>
        ) : null}

        {shelf.isSuccess ? (
          <Results
            shelf={shelf.data}
            units={units}
            updating={shelf.isPlaceholderData}
            filtered={chosen > 0}
            noMatches={renderNoMatches?.(search.filters)}
            pageHref={pageHref}
            // A new page replaces the cards in place: take the reader back to the top of the list.
            onPage={() => resultsHeading.current?.focus()}
            onClear={() => setFilters({})}
          />
        ) : null}
      </section>
    </div>
  );
}

/** One line saying what is shown, read out as it changes. */
function shelfStatus({ items, page, pageSize, total, totalCapped }: ShelfPage, updating: boolean, filtered: boolean): string {
  if (updating) return 'Updating…';
  if (total === 0) return filtered ? 'No bundle matches these filters.' : 'The shelf is empty just now.';
  const pageCount = Math.ceil(total / pageSize);
  if (items.length === 0 && totalCapped) return `There is no page ${page}; this search has fewer pages.`;
  if (items.length === 0) return `There is no page ${page}; this search has ${pageCount === 1 ? 'one page' : `${pageCount} pages`}.`;
  const first = (page - 1) * pageSize + 1;
  const shown = `${first.toLocaleString('en')}–${(first + items.length - 1).toLocaleString('en')}`;
  // The API stops counting at 1,000 matches (a text search, four pages past the page asked for);
  // past that, the shelf says so instead of a number.
  if (totalCapped) return `Showing ${shown} of more than ${total.toLocaleString('en')} bundles`;
  return `Showing ${shown} of ${total} ${total === 1 ? 'bundle' : 'bundles'}`;
}

interface ResultsProps {
  shelf: ShelfPage;
  units: UnitSystem;
  updating: boolean;
  filtered: boolean;
  noMatches?: ReactNode;
  pageHref: (page: number) => string;
  onPage: () => void;
  onClear: () => void;
}

function Results({ shelf, units, updating, filtered, noMatches, pageHref, onPage, onClear }: ResultsProps) {
  const { items, page, pageSize, total, totalCapped } = shelf;
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  // Past the count's cap the last page is unknown: there are at least as many pages as the one shown,
  // and a full page may have more after it.
  const knownPages = totalCapped ? Math.max(page, pageCount) : pageCount;
  const hasNext = page < knownPages || (totalCapped && items.length === pageSize);

  return (
    <div className="space-y-4">
      {total === 0 && !updating ? (
        filtered ? (
          <div className="space-y-3 rounded-stitch border-2 border-dashed border-seam p-6">
            {noMatches ?? (
              <p>Try fewer filters, or save these as a wish (the button under the filters): you will hear by e-mail when a bundle like this is approved.</p>
            )}
            <Button variant="secondary" onClick={onClear}>
              Clear filters
            </Button>
          </div>
        ) : (
          <p className="rounded-stitch border-2 border-dashed border-seam p-6">
            Bundles appear here once the librarian has checked and approved them. Come back soon, or save a wish to hear by e-mail.
          </p>
        )
      ) : null}

      {items.length === 0 && total > 0 && !updating ? (
        <ButtonLink to={pageHref(1)} variant="secondary">
          Go to the first page
        </ButtonLink>
      ) : null}

      {items.length > 0 ? (
        <ul aria-busy={updating || undefined} className={cn('grid gap-4 sm:grid-cols-2 xl:grid-cols-3', updating && 'opacity-60')}>
          {items.map((bundle, index) => (
            <BundleCard key={bundle.id} bundle={bundle} units={units} photoLoading={cardPhotoLoading(index)} />
          ))}
        </ul>
      ) : null}

      {knownPages > 1 ? (
        <nav aria-label="Shelf pages" className="flex flex-wrap items-center justify-between gap-3">
          {page > 1 ? (
            <ButtonLink to={pageHref(Math.min(page - 1, knownPages))} variant="secondary" onClick={onPage}>
              ← Previous page
            </ButtonLink>
          ) : (
            <span />
          )}
          <p className="font-semibold">
            Page {Math.min(page, knownPages)} of {knownPages}
            {totalCapped ? ' or more' : ''}
          </p>
          {hasNext ? (
            <ButtonLink to={pageHref(page + 1)} variant="secondary" onClick={onPage}>
              Next page →
            </ButtonLink>
          ) : (
            <span />
          )}
        </nav>
      ) : null}
    </div>
  );
}
