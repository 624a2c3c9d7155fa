import { Router, type Request, type Response } from 'express';
import passport from 'passport';
import { rateLimit } from 'express-rate-limit';
import type pg from 'pg';
import { signInSchema, type SessionResponse } from '@scrap-relay/shared';
import type { Member } from '../../db/models/index.ts';
import { accountInactive, invalidCredentials, rateLimited } from '../../errors/index.ts';
import { ensureCsrfToken } from '../../middleware/csrf.ts';
import { PostgresRateLimitStore } from '../../middleware/rate-limit-store.ts';
import { parseInput } from '../../middleware/validate.ts';
import type { AppContext } from '../../context.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { presentGuildSummary, presentSessionUser } from '../members/members.presenter.ts';

function authenticateLocal(req: Request, res: Response): Promise<Member | false> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (err: unknown, user: Member | false) => (err ? reject(err) : resolve(user)))(req, res, reject);
  });
}

/** passport 0.7 regenerates the session id at sign-in, so a session fixed before sign-in is worthless after it. */
const logIn = (req: Request, member: Member) =>
  new Promise<void>((resolve, reject) => req.login(member, (err) => (err ? reject(err) : resolve())));

const accountKey = (req: Request) => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
};

export function sessionRoutes(ctx: AppContext, pool: pg.Pool): Router {
  const router = Router();
  const { perAccount, perIp, windowMs } = ctx.config.signInLimits;
  const minutes = Math.ceil(windowMs / 60_000);
  const limiterDefaults = {
    windowMs,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: (_req: Request, _res: Response, next: (err: unknown) => void) => next(rateLimited(minutes)),
  };
  const perIpLimiter = rateLimit({ ...limiterDefaults, limit: perIp, store: new PostgresRateLimitStore(pool, 'sign-in-ip:') });
  const perAccountLimiter = rateLimit({
    ...limiterDefaults,
    limit: perAccount,
    store: new PostgresRateLimitStore(pool, 'sign-in-account:'),
    keyGenerator: (req) => accountKey(req),
    // Without an e-mail address there is no account to protect; the per-address limit still applies.
    skip: (req) => accountKey(req) === '',
  });

  router.get('/session', async (req, res) => {
    const guild = await loadGuild();
    const body: SessionResponse = {
      user: req.user ? presentSessionUser(req.user as Member, guild, ctx.now()) : null,
      guild: presentGuildSummary(guild),
      csrfToken: ensureCsrfToken(req.session),
    };
    res.json(body);
  });

  router.post('/session', perIpLimiter, perAccountLimiter, async (req, res) => {
    parseInput(signInSchema, req.body);
    const member = await authenticateLocal(req, res);
    if (!member) throw invalidCredentials();
    if (!member.active) throw accountInactive();
    await logIn(req, member);
    const guild = await loadGuild();
    res.json({ user: presentSessionUser(member, guild, ctx.now()), csrfToken: ensureCsrfToken(req.session) });
  });

  router.delete('/session', async (req, res) => {
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
    res.clearCookie('sr.sid');
    res.status(204).end();
  });

  return router;
}
