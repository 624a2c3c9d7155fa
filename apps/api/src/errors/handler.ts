import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ErrorBody } from '@scrap-relay/shared';
import { AppError, invalidJson, payloadTooLarge, serviceUnavailable } from './app-error.ts';

const DATABASE_DOWN = new Set(['ECONNREFUSED', 'ECONNRESET', '57P01', '57P03', 'ETIMEDOUT']);

/** Maps anything thrown to the one response shape; internals never reach the client. */
export function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  const e = err as { type?: string; status?: number; code?: string; name?: string; parent?: { code?: string }; original?: { code?: string } };
  if (e?.type === 'entity.parse.failed') return invalidJson();
  if (e?.type === 'entity.too.large') return payloadTooLarge();
  if (e?.type === 'charset.unsupported' || e?.type === 'encoding.unsupported')
    return new AppError(415, 'unsupported_media_type', 'Send JSON encoded as UTF-8.', { body: 'Unsupported encoding.' });
  const dbCode = e?.parent?.code ?? e?.original?.code ?? e?.code;
  if (e?.name === 'SequelizeConnectionError' || e?.name === 'SequelizeConnectionRefusedError' || (dbCode && DATABASE_DOWN.has(dbCode)))
    return serviceUnavailable('The guild’s database is not answering just now. Please try again in a minute.');
  // A deadlock or a serialisation failure: two requests met over the same rows, and this one was rolled back whole.
  if (dbCode === '40P01' || dbCode === '40001') return serviceUnavailable('Someone else was changing the same thing at that moment. Please try again.');
  return new AppError(500, 'internal', 'Something went wrong on our side. Please try again.');
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const appError = toAppError(err);
  if (appError.status >= 500) req.log?.error({ err }, 'request failed');
  const body: ErrorBody = { error: { code: appError.code, message: appError.message } };
  if (appError.fields) body.error.fields = appError.fields;
  if (appError.status === 503) res.set('Retry-After', '10');
  res.status(appError.status).json(body);
};

export const notFoundHandler: RequestHandler = (_req, res) => {
  const body: ErrorBody = { error: { code: 'not_found', message: 'No such API route.' } };
  res.status(404).json(body);
};
