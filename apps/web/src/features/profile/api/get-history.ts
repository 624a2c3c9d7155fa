import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MemberHistory } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';

/** What the member has passed on and received through the exchange. */
export const getHistory = ({ signal }: { signal?: AbortSignal } = {}): Promise<{ history: MemberHistory }> => api.get('/me/history', { signal });

export const getHistoryQueryOptions = () => queryOptions({ queryKey: ['profile', 'history'], queryFn: ({ signal }) => getHistory({ signal }) });

export const useHistory = () => useQuery(getHistoryQueryOptions());

/** The data export is a file download the browser makes itself (the API answers with an attachment). */
export const DATA_EXPORT_HREF = '/api/me/export';
