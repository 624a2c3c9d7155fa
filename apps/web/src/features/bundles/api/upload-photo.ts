import { ERROR_CODES, type BundleView, type ErrorBody, type ErrorCode } from '@scrap-relay/shared';
import { api, ApiError } from '../../../lib/api-client.ts';

export interface UploadProgress {
  loaded: number;
  total: number;
}

export interface UploadPhotoOptions {
  bundleId: string;
  file: File;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/** The multipart field the API reads photos from. */
export const PHOTO_FIELD = 'photos';

interface RawAnswer {
  status: number;
  text: string;
}

const knownCodes = new Set<string>(ERROR_CODES);

// Wording for answers without the API's error body (a proxy cutting the upload short, the connection dropping).
const FALLBACK: Record<number, { code: ErrorCode; message: string }> = {
  0: { code: 'service_unavailable', message: 'The photo could not be sent. Check your connection and try again.' },
  413: { code: 'payload_too_large', message: 'That photo is too large to send.' },
};

function parse(text: string): unknown {
  try {
    return text ? (JSON.parse(text) as unknown) : undefined;
  } catch {
    return undefined;
  }
}

function toApiError({ status, text }: RawAnswer): ApiError {
  const body = parse(text) as Partial<ErrorBody> | undefined;
  const error = body?.error;
  if (error && typeof error.message === 'string' && knownCodes.has(error.code)) {
    return new ApiError(status, error.code, error.message, error.fields ?? {});
  }
  const fallback = FALLBACK[status] ?? {
    code: status >= 500 ? ('service_unavailable' as const) : ('bad_request' as const),
    message: 'The photo was not accepted. Please try again.',
  };
  return new ApiError(status, fallback.code, fallback.message);
}

/** One multipart POST through XMLHttpRequest, because fetch reports no upload progress. */
function send({ bundleId, file, onProgress, signal }: UploadPhotoOptions, csrfToken: string): Promise<RawAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/bundles/${encodeURIComponent(bundleId)}/photos`);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('X-CSRF-Token', csrfToken);
    xhr.upload.onprogress = (event) => onProgress?.({ loaded: event.loaded, total: event.lengthComputable ? event.total : file.size });
    xhr.onload = () => resolve({ status: xhr.status, text: xhr.responseText });
    xhr.onerror = () => resolve({ status: 0, text: '' });
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    const form = new FormData();
    form.append(PHOTO_FIELD, file, file.name);
    xhr.send(form);
  });
}

let csrfToken: string | null = null;

/**
 * Uploads one photo with progress and answers with the whole bundle. Errors are
 * ApiErrors like every other request: 415 not a photo, 422 an image too large to
 * open, 400 a ninth photo, 413 a file over 15 MB.
 */
export async function uploadPhoto(options: UploadPhotoOptions): Promise<{ bundle: BundleView }> {
  csrfToken ??= (await api.getSession()).csrfToken;
  let answer = await send(options, csrfToken);
  if (answer.status === 403 && toApiError(answer).code === 'csrf_invalid') {
    // The token rotates at sign-in and when the session is renewed: read it again and try once more.
    csrfToken = (await api.getSession()).csrfToken;
    answer = await send(options, csrfToken);
  }
  if (answer.status >= 200 && answer.status < 300) return parse(answer.text) as { bundle: BundleView };
  throw toApiError(answer);
}
