import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Logger } from 'pino';
import { pinoHttp } from 'pino-http';

/** Values of these query parameters are secrets: the e-mailed links to confirm an address or set a password carry one. */
const SECRET_PARAMETER = /([?&](?:token|code|key)=)[^&#]*/gi;

/** The request as logged: no headers, so no session cookie, and no secret in the address. */
export function loggedRequest(req: IncomingMessage & { id?: unknown; originalUrl?: string }) {
  return {
    id: req.id,
    method: req.method,
    url: (req.originalUrl ?? req.url ?? '').replace(SECRET_PARAMETER, '$1[redacted]'),
    remoteAddress: req.socket?.remoteAddress,
  };
}

export function loggedResponse(res: ServerResponse) {
  return { statusCode: res.statusCode };
}

/**
 * One log line per request, with its id (taken from `X-Request-Id` or made here, and sent back). Only what an
 * operator needs to follow a request is written: a log file must never be a way into a member's session.
 */
export function requestLog(logger: Logger) {
  return pinoHttp({
    logger,
    wrapSerializers: false,
    serializers: { req: loggedRequest, res: loggedResponse },
    genReqId: (req, res) => {
      const id = (req.headers['x-request-id'] as string | undefined) ?? randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    autoLogging: { ignore: (req) => req.url === '/api/health' },
  });
}
