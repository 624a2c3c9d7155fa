import type { ErrorCode } from '@scrap-relay/shared';
import type { ZodError } from 'zod';

/** The one error type of the API: a stable code, an HTTP status, a message for people, and the fields at fault. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) => new AppError(400, 'bad_request', message, fields);
export const invalidJson = () => new AppError(400, 'invalid_json', 'The request body is not valid JSON.', { body: 'Not valid JSON.' });
export const payloadTooLarge = (field = 'body') =>
  new AppError(413, 'payload_too_large', 'The request is too large.', { [field]: 'Too large.' });
export const unauthenticated = () => new AppError(401, 'unauthenticated', 'Please sign in first.');
export const invalidCredentials = () => new AppError(401, 'invalid_credentials', 'That e-mail address or password is not right.');
export const emailNotVerified = () =>
  new AppError(403, 'email_not_verified', 'Please confirm your e-mail address first: use the link we sent you.');
export const accountInactive = () =>
  new AppError(403, 'account_inactive', 'This account is switched off. Ask a guild admin if you think this is a mistake.');
export const forbidden = (message = 'Your account may not do that.') => new AppError(403, 'forbidden', message);
export const csrfInvalid = () =>
  new AppError(403, 'csrf_invalid', 'The page was open too long or the request did not come from Scrap Relay. Reload and try again.', {
    'X-CSRF-Token': 'Missing or wrong.',
  });
export const notFound = (what = 'That') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError(409, 'conflict', message, fields);
export const emailTaken = () =>
  new AppError(409, 'email_taken', 'An account with that e-mail address already exists. Try signing in.', {
    email: 'Already has an account.',
  });
export const invalidInviteCode = () =>
  new AppError(400, 'invalid_invite_code', 'That invite code is not the guild’s current code.', { inviteCode: 'Not the current code.' });
export const invalidToken = () =>
  new AppError(400, 'invalid_token', 'This link has expired or was already used. Ask for a new one.', { token: 'Expired or used.' });
export const unsupportedMediaType = (field: string, message: string) => new AppError(415, 'unsupported_media_type', message, { [field]: message });
export const unprocessable = (message: string, fields?: Record<string, string>) => new AppError(422, 'unprocessable', message, fields);
export const rateLimited = (minutes: number) =>
  new AppError(429, 'rate_limited', `Too many attempts. Please wait ${minutes} minutes and try again.`);
export const serviceUnavailable = (message: string) => new AppError(503, 'service_unavailable', message);

/** Turns zod's issues into one message per field; unknown keys are named as fields too. */
export function validationFailed(error: ZodError): AppError {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...issue.path, key].join('.')] = 'Unknown field.';
      continue;
    }
    const path = issue.path.join('.') || 'body';
    fields[path] ??= issue.message;
  }
  const names = Object.keys(fields).join(', ');
  return new AppError(400, 'validation_failed', `Please check: ${names}.`, fields);
}
