import { ERROR_CODES, type ErrorBody } from '@scrap-relay/shared';
import { api, ApiError } from '../../../lib/api-client.ts';

const knownCodes = new Set<string>(ERROR_CODES);

const isErrorBody = (value: unknown): value is ErrorBody =>
  typeof value === 'object' &&
  value !== null &&
  'error' in value &&
  typeof (value as ErrorBody).error?.code === 'string' &&
  knownCodes.has((value as ErrorBody).error.code);

/**
 * DELETE with a JSON body (the removal reason). The shared client sends DELETE without
 * a body, so this reads a fresh CSRF token from the session and sends the request itself,
 * failing with the same ApiError the rest of the app handles.
 */
export async function deleteWithBody(path: string, body: unknown): Promise<void> {
  const { csrfToken } = await api.getSession();
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method: 'DELETE',
      headers: { Accept: 'application/json', 'Content-Type': 'application/json', 'X-CSRF-Token': csrfToken },
      body: JSON.stringify(body),
      credentials: 'same-origin',
    });
  } catch {
    throw new ApiError(0, 'service_unavailable', 'Scrap Relay could not be reached. Check your connection and try again.');
  }
  if (response.ok) return;
  const parsed: unknown = await response.json().catch(() => undefined);
  if (isErrorBody(parsed)) throw new ApiError(response.status, parsed.error.code, parsed.error.message, parsed.error.fields ?? {});
  throw new ApiError(response.status, response.status >= 500 ? 'service_unavailable' : 'bad_request', 'The request was not accepted. Please try again.');
}
