import type { RequestHandler } from 'express';
import { newToken, safeEqual } from '../auth/tokens.ts';
import { csrfInvalid } from '../errors/index.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Synchroniser token per session: GET /api/session hands it out; every state-changing request echoes it in X-CSRF-Token. */
export function csrfProtection(exemptPaths: string[]): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || exemptPaths.includes(req.path)) return next();
    const expected = req.session?.csrfToken;
    const given = req.get('x-csrf-token');
    if (!expected || !given || !safeEqual(expected, given)) return next(csrfInvalid());
    next();
  };
}

export function ensureCsrfToken(session: { csrfToken?: string }): string {
  session.csrfToken ??= newToken();
  return session.csrfToken;
}
