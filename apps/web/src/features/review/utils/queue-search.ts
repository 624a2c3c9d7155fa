import { OFFERS, type Offer } from '@scrap-relay/shared';

/**
 * The review queue's view as it travels in the address (`/review?sort=-title&offer=starter&seller=…&page=2`),
 * as the shelf keeps its search: Back, reload and the review page's "Back to the queue" link all return to it.
 */

/** The columns the queue sorts by: the bundle's title, or how long it has waited. */
export const QUEUE_SORT_COLUMNS = ['submittedAt', 'title'] as const;
export type QueueSortColumn = (typeof QUEUE_SORT_COLUMNS)[number];

export interface QueueSearch {
  sort: { column: QueueSortColumn; desc: boolean };
  offer: Offer | '';
  sellerId: string;
  /** 1-based, as people count pages. */
  page: number;
}

/** Longest waiting first, every offer and seller, the first page. */
export const DEFAULT_QUEUE_SEARCH: QueueSearch = { sort: { column: 'submittedAt', desc: false }, offer: '', sellerId: '', page: 1 };

const MAX_PAGE = 10_000;
const SELLER_ID = /^[0-9a-zA-Z-]{1,64}$/;

/** Whatever of the address is valid; anything else falls back to the default, so an old or edited link still opens the queue. */
export function readQueueSearch(params: URLSearchParams): QueueSearch {
  const sort = params.get('sort') ?? '';
  const desc = sort.startsWith('-');
  const column = (QUEUE_SORT_COLUMNS as readonly string[]).find((c) => c === (desc ? sort.slice(1) : sort)) as QueueSortColumn | undefined;
  const offer = params.get('offer') ?? '';
  const sellerId = params.get('seller') ?? '';
  const page = Number(params.get('page') ?? '1');
  return {
    sort: column ? { column, desc } : DEFAULT_QUEUE_SEARCH.sort,
    offer: (OFFERS as readonly string[]).includes(offer) ? (offer as Offer) : '',
    sellerId: SELLER_ID.test(sellerId) ? sellerId : '',
    page: Number.isInteger(page) && page >= 1 && page <= MAX_PAGE ? page : 1,
  };
}

/** The address query for a view; defaults are left out, so the plain queue is plain `/review`. */
export function queueSearchParams(search: QueueSearch): URLSearchParams {
  const params = new URLSearchParams();
  const { column, desc } = search.sort;
  if (column !== DEFAULT_QUEUE_SEARCH.sort.column || desc !== DEFAULT_QUEUE_SEARCH.sort.desc) params.set('sort', `${desc ? '-' : ''}${column}`);
  if (search.offer) params.set('offer', search.offer);
  if (search.sellerId) params.set('seller', search.sellerId);
  if (search.page > 1) params.set('page', String(search.page));
  return params;
}

/** "?offer=starter&page=2", or "" for the default view: what to put after `/review`. */
export function queueSearchString(search: QueueSearch): string {
  const query = queueSearchParams(search).toString();
  return query ? `?${query}` : '';
}

/**
 * The queue's query handed to the review page (in the link's history state), read back safely: only a query
 * string, re-read and re-written, so nothing but the queue's own keys reaches the "Back to the queue" link.
 */
export function queueReturnSearch(state: unknown): string {
  const raw = typeof state === 'object' && state !== null ? (state as { queueSearch?: unknown }).queueSearch : undefined;
  if (typeof raw !== 'string' || !raw.startsWith('?')) return '';
  return queueSearchString(readQueueSearch(new URLSearchParams(raw)));
}
