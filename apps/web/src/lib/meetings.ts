import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MeetingView } from '@scrap-relay/shared';
import { api } from './api-client.ts';

/**
 * Guild meetings, read by several features (the meetings page, choosing where to
 * collect a starter bundle, moving handovers), so they share one cache entry.
 */
export type MeetingsWhen = 'upcoming' | 'all';

export const meetingsQueryKey = ['meetings'] as const;

/** Upcoming meetings come soonest first; "all" comes newest first (the API's order). */
export const getMeetings = (when: MeetingsWhen, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: MeetingView[] }> =>
  api.get('/meetings', { query: { when }, signal });

export const getMeetingsQueryOptions = (when: MeetingsWhen = 'upcoming') =>
  queryOptions({ queryKey: [...meetingsQueryKey, when], queryFn: ({ signal }) => getMeetings(when, { signal }) });

export const useMeetings = (when: MeetingsWhen = 'upcoming') => useQuery(getMeetingsQueryOptions(when));
