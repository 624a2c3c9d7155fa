/**
 * Errors in the shape Stripe's API returns them, so the SDK maps each one to
 * its own error class (StripeInvalidRequestError, StripeCardError, …).
 */

export type StripeErrorType = 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error';

export interface StripeErrorBody {
  error: {
    type: StripeErrorType;
    message: string;
    code?: string;
    param?: string;
    decline_code?: string;
  };
}

export class StripeFakeError extends Error {
  constructor(
    readonly status: number,
    readonly type: StripeErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
    readonly declineCode?: string,
    /**
     * Stripe saves an idempotent result only once the endpoint starts work;
     * a request rejected while its parameters are checked is not saved.
     */
    readonly beforeExecution = false,
  ) {
    super(message);
    this.name = 'StripeFakeError';
  }

  toBody(): StripeErrorBody {
    return {
      error: {
        type: this.type,
        message: this.message,
        ...(this.code === undefined ? {} : { code: this.code }),
        ...(this.param === undefined ? {} : { param: this.param }),
        ...(this.declineCode === undefined ? {} : { decline_code: this.declineCode }),
      },
    };
  }
}

export function parameterMissing(param: string): StripeFakeError {
  return new StripeFakeError(400, 'invalid_request_error', `Missing required param: ${param}.`, 'parameter_missing', param, undefined, true);
}

export function parameterInvalid(param: string, message: string, code = 'parameter_invalid'): StripeFakeError {
  return new StripeFakeError(400, 'invalid_request_error', message, code, param, undefined, true);
}

export function parameterUnknown(param: string): StripeFakeError {
  return new StripeFakeError(
    400,
    'invalid_request_error',
    `Received unknown parameter: ${param} (the local Stripe stand-in does not implement it)`,
    'parameter_unknown',
    param,
    undefined,
    true,
  );
}

export function resourceMissing(kind: string, id: string, param = 'id'): StripeFakeError {
  return new StripeFakeError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, 'resource_missing', param);
}

export function invalidRequest(message: string, code?: string, param?: string): StripeFakeError {
  return new StripeFakeError(400, 'invalid_request_error', message, code, param);
}

export function cardDeclined(): StripeFakeError {
  return new StripeFakeError(402, 'card_error', 'Your card was declined.', 'card_declined', undefined, 'generic_decline');
}

export function authenticationFailed(message: string): StripeFakeError {
  return new StripeFakeError(401, 'invalid_request_error', message);
}
