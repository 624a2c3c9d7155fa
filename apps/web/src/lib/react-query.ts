import { MutationCache, QueryCache, QueryClient, type DefaultOptions, type UseMutationOptions } from '@tanstack/react-query';
import { isApiError, type ApiError } from './api-client.ts';

const MAX_RETRIES = 2;

// A 4xx answer will not change on retry; only network trouble and 5xx are worth another try.
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < MAX_RETRIES;
}

const queryDefaults = {
  queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: true },
  mutations: { retry: false },
} satisfies DefaultOptions;

export interface QueryClientHooks {
  /** Any request answered 401: the session ended elsewhere (expired, signed out in another tab). */
  onUnauthenticated?: () => void;
}

export function createQueryClient({ onUnauthenticated }: QueryClientHooks = {}): QueryClient {
  const notice = (error: unknown) => {
    if (isApiError(error) && error.code === 'unauthenticated') onUnauthenticated?.();
  };
  return new QueryClient({
    defaultOptions: queryDefaults,
    queryCache: new QueryCache({ onError: notice }),
    mutationCache: new MutationCache({ onError: notice }),
  });
}

/** Options a caller may add to a feature's mutation hook (e.g. an extra `onSuccess`). */
export type MutationConfig<TVariables, TData = unknown> = Omit<
  UseMutationOptions<TData, ApiError, TVariables>,
  'mutationFn'
>;
