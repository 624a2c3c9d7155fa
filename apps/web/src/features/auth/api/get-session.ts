import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionResponse, SessionUser } from '@scrap-relay/shared';
import { api } from '../../../lib/api-client.ts';
import { SESSION_CACHE_KEY } from '../../../utils/guild-session.ts';

/** One key for the session everywhere: shared code that follows the session (guild-session.ts) defines it. */
export const sessionQueryKey = SESSION_CACHE_KEY;

export const getSession = ({ signal }: { signal?: AbortSignal } = {}): Promise<SessionResponse> => api.getSession({ signal });

export const getSessionQueryOptions = () =>
  queryOptions({
    queryKey: sessionQueryKey,
    queryFn: ({ signal }) => getSession({ signal }),
    staleTime: 60_000,
  });

export const useSession = () => useQuery(getSessionQueryOptions());

/** The signed-in member on pages behind the sign-in guard (which has already loaded the session). */
export function useSessionUser(): SessionUser {
  const user = useSession().data?.user;
  if (!user) throw new Error('useSessionUser was called outside the signed-in routes.');
  return user;
}
