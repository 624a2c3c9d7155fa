/** Stable error codes every API error carries; the web app switches on these, never on messages. */
export const ERROR_CODES = [
  'bad_request',
  'validation_failed',
  'invalid_json',
  'payload_too_large',
  'unauthenticated',
  'invalid_credentials',
  'email_not_verified',
  'account_inactive',
  'forbidden',
  'csrf_invalid',
  'not_found',
  'conflict',
  'email_taken',
  'invalid_invite_code',
  'invalid_token',
  'unsupported_media_type',
  'unprocessable',
  'rate_limited',
  'service_unavailable',
  'internal',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: Record<string, string> };
}
