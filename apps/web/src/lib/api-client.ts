import { ERROR_CODES, queryString, type ErrorBody, type ErrorCode, type QueryValue, type SessionResponse } from '@scrap-relay/shared';

/** Every failed request becomes one of these, so screens switch on `code` and forms map `fields`. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  readonly status: number;
  readonly code: ErrorCode;
  readonly fields: Readonly<Record<string, string>>;

  constructor(status: number, code: ErrorCode, message: string, fields: Record<string, string> = {}) {
    super(message);
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export const isApiError = (value: unknown): value is ApiError => value instanceof ApiError;

export interface RequestOptions {
  query?: Record<string, QueryValue>;
  signal?: AbortSignal;
}

export interface ApiClientOptions {
  baseUrl?: string;
  fetch?: typeof fetch;
}

const SESSION_PATH = '/session';
const UNREACHABLE_MESSAGE = 'Scrap Relay could not be reached. Check your connection and try again.';

// Used when a response carries no error body (a proxy page, a crash); wording is ours, never the server's internals.
const FALLBACK_BY_STATUS: Record<number, { code: ErrorCode; message: string }> = {
  400: { code: 'bad_request', message: 'The request was not accepted. Check the form and try again.' },
  401: { code: 'unauthenticated', message: 'Please sign in again.' },
  403: { code: 'forbidden', message: 'This is not available for your account.' },
  404: { code: 'not_found', message: 'That could not be found. It may have been removed.' },
  413: { code: 'payload_too_large', message: 'That is too large to send.' },
  429: { code: 'rate_limited', message: 'Too many attempts. Please wait a few minutes and try again.' },
};

const knownCodes = new Set<string>(ERROR_CODES);

function isErrorBody(value: unknown): value is ErrorBody {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return (
    typeof error === 'object' &&
    error !== null &&
    typeof (error as { code?: unknown }).code === 'string' &&
    typeof (error as { message?: unknown }).message === 'string'
  );
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text.length === 0) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

async function toApiError(response: Response): Promise<ApiError> {
  const body = await readJson(response);
  if (isErrorBody(body) && knownCodes.has(body.error.code)) {
    return new ApiError(response.status, body.error.code, body.error.message, body.error.fields ?? {});
  }
  const fallback =
    FALLBACK_BY_STATUS[response.status] ??
    (response.status >= 500
      ? { code: 'service_unavailable' as const, message: 'Something went wrong on our side. Please try again in a moment.' }
      : { code: 'bad_request' as const, message: 'The request was not accepted.' });
  return new ApiError(response.status, fallback.code, fallback.message);
}

function buildUrl(baseUrl: string, path: string, query?: Record<string, QueryValue>): string {
  return `${baseUrl}${path}${query ? queryString(query) : ''}`;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type SessionListener = (session: SessionResponse) => void;

export function createApiClient({ baseUrl = '/api', fetch: fetchImpl = (...args) => globalThis.fetch(...args) }: ApiClientOptions = {}) {
  let csrfToken: string | null = null;
  const sessionListeners = new Set<SessionListener>();

  async function send<T>(method: Method, path: string, body: unknown, options: RequestOptions, isRetry: boolean): Promise<T> {
    const headers: Record<string, string> = { Accept: 'application/json' };
    // The token only guards writes; fetch one first if the session has not been read yet.
    if (method !== 'GET') {
      if (csrfToken === null) await refreshSession();
      headers['X-CSRF-Token'] = csrfToken ?? '';
    }
    let payload: BodyInit | undefined;
    if (body instanceof FormData) {
      payload = body;
    } else if (body !== undefined) {
      headers['Content-Type'] = 'application/json';
      payload = JSON.stringify(body);
    }

    let response: Response;
    try {
      response = await fetchImpl(buildUrl(baseUrl, path, options.query), {
        method,
        headers,
        body: payload,
        credentials: 'same-origin',
        signal: options.signal,
      });
    } catch (cause) {
      if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
      throw new ApiError(0, 'service_unavailable', UNREACHABLE_MESSAGE);
    }

    if (response.ok) return (await readJson(response)) as T;

    const error = await toApiError(response);
    // The token rotates at sign-in and when the session expires: read the session again and try once more.
    if (error.code === 'csrf_invalid' && !isRetry) {
      await refreshSession();
      return send<T>(method, path, body, options, true);
    }
    throw error;
  }

  async function getSession(options: RequestOptions = {}): Promise<SessionResponse> {
    const session = await send<SessionResponse>('GET', SESSION_PATH, undefined, options, false);
    csrfToken = session.csrfToken;
    return session;
  }

  async function refreshSession(): Promise<void> {
    const session = await getSession();
    for (const listener of sessionListeners) listener(session);
  }

  return {
    get: <T>(path: string, options: RequestOptions = {}) => send<T>('GET', path, undefined, options, false),
    post: <T>(path: string, body?: unknown, options: RequestOptions = {}) => send<T>('POST', path, body, options, false),
    put: <T>(path: string, body?: unknown, options: RequestOptions = {}) => send<T>('PUT', path, body, options, false),
    patch: <T>(path: string, body?: unknown, options: RequestOptions = {}) => send<T>('PATCH', path, body, options, false),
    delete: <T = void>(path: string, options: RequestOptions = {}) => send<T>('DELETE', path, undefined, options, false),
    /** Reads `GET /api/session` and keeps its CSRF token for later writes. */
    getSession,
    /** Called when the client re-read the session on its own (after a CSRF rejection), so caches can follow. */
    onSessionRefreshed(listener: SessionListener): () => void {
      sessionListeners.add(listener);
      return () => sessionListeners.delete(listener);
    },
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;

export const api = createApiClient();
