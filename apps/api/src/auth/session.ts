import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Request } from 'express';
import type pg from 'pg';
import type { InferCreationAttributes } from 'sequelize';
import type { Config } from '../config/index.ts';
import { modelColumns } from '../db/model-columns.ts';
import { Member } from '../db/models/index.ts';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

const THIRTY_DAYS_MS = 30 * 24 * 60 * 60 * 1000;

/** The session cookie's name. */
export const SESSION_COOKIE = 'sr.sid';

/** The member row read with the session, held only for the request that read it (see `takeSignedInMember`). */
const MEMBER_ROW = Symbol('member row');
const membersReadWithSession = new WeakMap<object, Record<string, unknown>>();

type StoredSession = session.SessionData & { [MEMBER_ROW]?: Record<string, unknown> };

/**
 * The session store of connect-pg-simple, reading the signed-in member in the same statement as the session:
 * one round trip instead of two on every signed-in request. Writing, touching and pruning are the package's own.
 */
function sessionStore(pool: pg.Pool) {
  const PgStore = connectPgSimple(session);
  let statement: string | undefined;

  return new (class extends PgStore {
    override get(sid: string, done: (err: unknown, sess?: session.SessionData | null) => void) {
      statement ??= `SELECT s.sess, ${modelColumns(Member, { alias: 'm', prefix: 'm.' })}
        FROM session s LEFT JOIN members m ON m.id = (s.sess #>> '{passport,user}')::uuid
        WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`;
      pool
        .query({ name: 'session-with-member', text: statement, values: [sid, Math.ceil(Date.now() / 1000)] })
        .then(({ rows: [row] }) => {
          if (!row) return done(null, null);
          const sess = (typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess) as StoredSession;
          if (row['m.id'] !== null) {
            const member: Record<string, unknown> = {};
            for (const [column, value] of Object.entries(row)) if (column.startsWith('m.')) member[column.slice(2)] = value;
            // A symbol key: never copied into req.session, never serialised back to the table.
            sess[MEMBER_ROW] = member;
          }
          done(null, sess);
        })
        .catch(done);
    }

    override createSession(req: Request, sess: session.SessionData) {
      const stored = sess as StoredSession;
      if (stored[MEMBER_ROW]) membersReadWithSession.set(req, stored[MEMBER_ROW]);
      delete stored[MEMBER_ROW];
      return super.createSession(req, sess);
    }
  })({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60, disableTouch: true });
}

/** The member row the session store read for this request, if it belongs to `id`; a second call gets nothing. */
export function takeSignedInMember(req: object, id: string): Member | null {
  const row = membersReadWithSession.get(req);
  membersReadWithSession.delete(req);
  return row && row.id === id ? Member.build(row as unknown as InferCreationAttributes<Member>, { isNewRecord: false, raw: true }) : null;
}

/** Sessions live in PostgreSQL so any API process behind a load balancer can serve any request. */
export function sessionMiddleware(config: Config, pool: pg.Pool) {
  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    // No write per request: a session lasts 30 days from its last change (sign-in, CSRF token), which keeps
    // reads cheap for every API process sharing the table.
    store: sessionStore(pool),
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
