import { FIBRE_LABELS, formatWeight, OFFER_LABELS, OFFERS, type Offer, type ReviewQueueRow, type UnitSystem } from '@scrap-relay/shared';
import { useCallback, useId, useMemo } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { paths } from '../../../config/paths.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { Select } from '../../../components/ui/field.tsx';
import { Loading } from '../../../components/ui/loading.tsx';
import { DataTable, dataTableColumns } from '../../../components/ui/table.tsx';
import { formatOffer } from '../../../utils/bundle-text.ts';
import { formatDate } from '../../../utils/format.ts';
import { useGuildTimeZone } from '../../../utils/guild-session.ts';
import { useReviewQueue } from '../api/get-review-queue.ts';
import { useQueueSearch } from '../hooks/use-queue-search.ts';
import { QUEUE_SORT_COLUMNS } from '../utils/queue-search.ts';
import { formatWaitingTime } from '../utils/waiting-time.ts';
import { Disclosures } from './disclosures.tsx';

const column = dataTableColumns<ReviewQueueRow>();

const offerFilterOptions = [{ value: '', label: 'Any offer' }, ...OFFERS.map((offer) => ({ value: offer, label: OFFER_LABELS[offer] }))];

/** The librarian's queue: oldest first, narrowed by offer or seller, each row opening the review page. */
export function ReviewQueueTable({ units }: { units: UnitSystem }) {
  const queue = useReviewQueue();
  const { search, setSort, setOffer, setSellerId, setPage, fixPage } = useQueueSearch();
  const { offer, sellerId } = search;
  const sorting = useMemo(() => [{ id: search.sort.column, desc: search.sort.desc }], [search.sort.column, search.sort.desc]);
  const changeSorting = useCallback(
    (next: { id: string; desc: boolean }[]) => {
      const column = QUEUE_SORT_COLUMNS.find((c) => c === next[0]?.id);
      if (column) setSort(column, next[0]!.desc);
    },
    [setSort],
  );
  const changePage = useCallback((index: number, pastTheEnd?: boolean) => (pastTheEnd ? fixPage(index + 1) : setPage(index + 1)), [fixPage, setPage]);
  const offerId = useId();
  const sellerSelectId = useId();
  const timeZone = useGuildTimeZone();

  const columns = useMemo(
    () =>
      column.columns([
        column.display({
          id: 'photo',
          header: 'Photo',
          cell: ({ row }) => <QueueThumbnail row={row.original} />,
        }),
        column.accessor('title', {
          header: 'Bundle',
          sortFn: 'text',
          cell: ({ row }) => <QueueTitle row={row.original} />,
        }),
        column.accessor((row) => row.seller.id, {
          id: 'seller',
          header: 'Seller',
          enableSorting: false,
          filterFn: 'includesString',
          cell: ({ row }) => <SellerHistory row={row.original} />,
        }),
        column.accessor('offer', {
          header: 'Offer and price',
          enableSorting: false,
          filterFn: 'includesString',
          cell: ({ row }) => (
            <div>
              <p className="font-semibold">{formatOffer(row.original.offer, row.original.priceMinor, row.original.currency)}</p>
              {/* A price alone does not say "sale"; the free offers already say what they are. */}
              {row.original.offer === 'sale' ? <p className="text-thread-soft">{OFFER_LABELS.sale}</p> : null}
            </div>
          ),
        }),
        column.accessor('weightGrams', {
          header: 'Weight',
          enableSorting: false,
          cell: ({ getValue }) => formatWeight(getValue(), units),
        }),
        column.display({
          id: 'disclosures',
          header: 'Disclosures',
          cell: ({ row }) => <Disclosures {...row.original.disclosures} />,
        }),
        column.accessor('submittedAt', {
          header: 'Waiting',
          // ISO timestamps sort correctly as text; the queue starts with whoever has waited longest.
          sortFn: 'text',
          meta: { sortLabels: ['Longest first', 'Newest first'] },
          cell: ({ getValue }) => (
            <div>
              <p className="font-semibold">{formatWaitingTime(getValue())}</p>
              <p className="text-thread-soft">since {formatDate(getValue(), timeZone)}</p>
            </div>
          ),
        }),
      ]),
    [units, timeZone],
  );

  const columnFilters = useMemo(
    () => [...(offer ? [{ id: 'offer', value: offer }] : []), ...(sellerId ? [{ id: 'seller', value: sellerId }] : [])],
    [offer, sellerId],
  );

  const sellerOptions = useMemo(() => {
    const sellers = new Map((queue.data?.items ?? []).map((row) => [row.seller.id, row.seller.name]));
    return [
      { value: '', label: 'Any seller' },
      ...[...sellers].sort((a, b) => a[1].localeCompare(b[1])).map(([value, label]) => ({ value, label })),
      // A seller kept in the address whose bundles have all been reviewed since.
      ...(sellerId && !sellers.has(sellerId) ? [{ value: sellerId, label: 'A seller with nothing waiting now' }] : []),
    ];
  }, [queue.data, sellerId]);

  if (queue.isPending) return <Loading label="Loading the review queue…" />;
  if (queue.isError) {
    return (
      <Alert tone="error" title="The review queue could not be loaded">
        <p>{queue.error.message}</p>
        <Button variant="secondary" onClick={() => queue.refetch()} isPending={queue.isFetching} pendingLabel="Trying…">
          Try again
        </Button>
      </Alert>
    );
  }

  const filtered = offer !== '' || sellerId !== '';
  return (
    <div className="space-y-6">
      <div role="search" aria-label="Narrow the queue" className="grid gap-4 rounded-stitch border-2 border-seam bg-muslin p-4 sm:grid-cols-2">
        <div className="space-y-1.5">
          <label htmlFor={offerId} className="block font-semibold">
            Offer
          </label>
          <Select id={offerId} options={offerFilterOptions} value={offer} onChange={(event) => setOffer(event.target.value as Offer | '')} />
        </div>
        <div className="space-y-1.5">
          <label htmlFor={sellerSelectId} className="block font-semibold">
            Seller
          </label>
          <Select id={sellerSelectId} options={sellerOptions} value={sellerId} onChange={(event) => setSellerId(event.target.value)} />
        </div>
      </div>

      <DataTable
        caption="Bundles waiting for review"
        data={queue.data.items}
        columns={columns}
        getRowId={(row) => row.id}
        columnFilters={columnFilters}
        sorting={sorting}
        onSortingChange={changeSorting}
        pageIndex={search.page - 1}
        onPageIndexChange={changePage}
        pageSize={20}
        noun={['bundle', 'bundles']}
        emptyMessage={filtered ? 'No bundle in the queue matches.' : 'Nothing is waiting for review. Well done!'}
      />
    </div>
  );
}

function QueueThumbnail({ row }: { row: ReviewQueueRow }) {
  return (
    <div className="flex items-center gap-3 md:block">
      {row.thumbUrl ? (
        <img src={row.thumbUrl} alt={`Photo: ${row.title}`} loading="lazy" decoding="async" className="size-24 rounded-stitch object-cover" />
      ) : (
        <p className="flex size-24 items-center justify-center rounded-stitch bg-linen-deep text-thread-soft">No photo</p>
      )}
      <p className="text-thread-soft">{row.photoCount === 1 ? '1 photo' : `${row.photoCount} photos`}</p>
    </div>
  );
}

function SellerHistory({ row }: { row: ReviewQueueRow }) {
  const { name, rehomedCount, returnedCount } = row.seller;
  return (
    <div>
      <p className="font-semibold">{name}</p>
      <p className="text-thread-soft">
        {rehomedCount} rehomed · {returnedCount} returned
      </p>
    </div>
  );
}

/** The title opens the review page; the link is tall enough to tap. */
function QueueTitle({ row }: { row: ReviewQueueRow }) {
  // The queue's view goes along, so the review page's "Back to the queue" returns to this sort, filter and page.
  const { search } = useLocation();
  return (
    <div className="md:min-w-48">
      <Link to={paths.app.reviewBundle.getHref(row.id)} state={{ queueSearch: search }} className="inline-flex min-h-11 items-center text-lg font-bold">
        {row.title}
      </Link>
      <p className="text-thread-soft">{FIBRE_LABELS[row.fibre]}</p>
      {row.abilities.review ? null : <p className="font-semibold text-ochre">Your own listing: another librarian reviews it.</p>}
    </div>
  );
}
