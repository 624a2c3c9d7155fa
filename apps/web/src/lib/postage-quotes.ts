import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PostageQuoteRequest, PostageQuoteView } from '@scrap-relay/shared';
import { api } from './api-client.ts';

/**
 * What posting these bundles to this postal code costs by the guild's table. A
 * POST because it carries a list, but it changes nothing, so it is read as a query.
 * Asked by the basket (a seller's bundles together) and the bundle page (one bundle).
 */
export const getPostageQuote = (request: PostageQuoteRequest, { signal }: { signal?: AbortSignal } = {}): Promise<PostageQuoteView> =>
  api.post('/postage-quotes', request, { signal });

export const getPostageQuoteQueryOptions = (request: PostageQuoteRequest) =>
  queryOptions({
    queryKey: ['postage-quote', request.destination.country, request.destination.postalCode, request.items] as const,
    queryFn: ({ signal }) => getPostageQuote(request, { signal }),
    // Keep the last quote on screen while the next one loads, so totals do not flicker as a postal code is typed.
    placeholderData: keepPreviousData,
  });

export const usePostageQuote = (request: PostageQuoteRequest | null) =>
  useQuery({
    ...getPostageQuoteQueryOptions(request ?? { items: [], destination: { country: '', postalCode: '' } }),
    enabled: request !== null,
  });
