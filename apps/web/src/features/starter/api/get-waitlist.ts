import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { WaitlistRow } from '@scrap-relay/shared';

export const waitlistQueryKey = ['waitlist'] as const;

/** The librarian's view of the queue, in the order people asked. */
export const getWaitlist = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: WaitlistRow[] }> => api.get('/waitlist', { signal });

export const getWaitlistQueryOptions = () => queryOptions({ queryKey: waitlistQueryKey, queryFn: ({ signal }) => getWaitlist({ signal }) });

export const useWaitlist = () => useQuery(getWaitlistQueryOptions());
