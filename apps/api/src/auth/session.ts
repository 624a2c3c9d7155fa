import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type pg from 'pg';
import type { Config } from '../config/index.ts';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

const THIRTY_DAYS_MS = 30 * 24 * 60 * 60 * 1000;

/** Sessions live in PostgreSQL so any API process behind a load balancer can serve any request. */
export function sessionMiddleware(config: Config, pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  return session({
    name: 'sr.sid',
    secret: config.sessionSecret,
    // No write per request: a session lasts 30 days from its last change (sign-in, CSRF token), which keeps
    // reads cheap for every API process sharing the table.
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60, disableTouch: true }),
    resave: false,
    saveUninitialized: false,
    rolling: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.env === 'production',
      maxAge: THIRTY_DAYS_MS,
    },
  });
}
