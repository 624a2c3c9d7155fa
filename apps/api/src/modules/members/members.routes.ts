import { Router, type Request, type Response } from 'express';
import { rateLimit, type Options } from 'express-rate-limit';
import type pg from 'pg';
import { z } from 'zod';
import {
  joinSchema,
  memberUpdateSchema,
  passwordResetCompleteSchema,
  passwordResetRequestSchema,
  tokenSchema,
} from '@scrap-relay/shared';
import type { Member } from '../../db/models/index.ts';
import { requireMember } from '../../middleware/authenticate.ts';
import { ensureCsrfToken } from '../../middleware/csrf.ts';
import { parseInput } from '../../middleware/validate.ts';
import { AppError, notFound } from '../../errors/index.ts';
import { PostgresRateLimitStore } from '../../middleware/rate-limit-store.ts';
import type { AppContext } from '../../context.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { actorOf, presentMemberRow, presentSessionUser } from './members.presenter.ts';
import * as members from './members.service.ts';

const memberIdSchema = z.uuid({ error: 'Not a member id.' });

const logIn = (req: Request, member: Member) =>
  new Promise<void>((resolve, reject) => req.login(member, (err) => (err ? reject(err) : resolve())));

/**
 * How many password-reset and verification e-mails may be asked for in an hour: per e-mail address (or signed-in
 * member) so nobody can flood one inbox, and per network address so nobody can flood many. Members asking from one
 * hall's network at a guild meeting stay well under the per-network figure.
 */
export const ACCOUNT_MAIL_LIMITS = { perAddress: 3, perIp: 20, windowMs: 60 * 60_000 } as const;

/** The address a reset is asked for, as the schema will normalise it; '' when there is none to count. */
const requestedAddress = (req: Request) => {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
};

/**
 * Every request counts, whether or not the address belongs to a member, and every limit gives the same answer,
 * so the limit cannot be used to learn who is a member.
 */
function accountMailLimiters(pool: pg.Pool) {
  const { perAddress, perIp, windowMs } = ACCOUNT_MAIL_LIMITS;
  const defaults: Partial<Options> = {
    windowMs,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (req: Request, _res: Response, next: (err: unknown) => void) => {
      const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const minutes = Math.max(1, Math.ceil(((resetTime?.getTime() ?? Date.now() + windowMs) - Date.now()) / 60_000));
      next(
        new AppError(
          429,
          'rate_limited',
          `Too many e-mails asked for in a short time. Please wait ${minutes} minute${minutes === 1 ? '' : 's'} before asking again; a link sent earlier still works until it expires.`,
        ),
      );
    },
  };
  return {
    perIp: rateLimit({ ...defaults, limit: perIp, store: new PostgresRateLimitStore(pool, 'account-mail-ip:') }),
    perAddress: rateLimit({
      ...defaults,
      limit: perAddress,
      store: new PostgresRateLimitStore(pool, 'password-reset-address:'),
      keyGenerator: requestedAddress,
      // No address, no inbox to protect: the schema answers 400 and the per-network limit still counts it.
      skip: (req) => requestedAddress(req) === '',
    }),
    perMember: rateLimit({
      ...defaults,
      limit: perAddress,
      store: new PostgresRateLimitStore(pool, 'verification-member:'),
      keyGenerator: (req) => req.user!.id,
      // Signed out: requireMember answers 401, and the per-network limit still counts it.
      skip: (req) => !req.user,
    }),
  };
}

export function membersRoutes(ctx: AppContext, pool: pg.Pool): Router {
  const router = Router();
  const limits = accountMailLimiters(pool);

  router.post('/members', async (req, res) => {
    const input = parseInput(joinSchema, req.body);
    const member = await members.joinGuild(ctx, input);
    await logIn(req, member);
    res.status(201).json({ user: presentSessionUser(member, await loadGuild(), ctx.now()), csrfToken: ensureCsrfToken(req.session) });
  });

  router.post('/email-verifications', async (req, res) => {
    const { token } = parseInput(tokenSchema, req.body);
    const member = await members.verifyEmailAddress(ctx, token);
    res.json({ user: presentSessionUser(member, await loadGuild(), ctx.now()) });
  });

  router.post('/email-verifications/resend', limits.perIp, limits.perMember, async (req, res) => {
    await members.resendVerification(ctx, requireMember(req));
    res.status(202).json({ status: 'queued' });
  });

  router.post('/password-resets', limits.perIp, limits.perAddress, async (req, res) => {
    const { email } = parseInput(passwordResetRequestSchema, req.body);
    await members.requestPasswordReset(ctx, email);
    res.status(202).json({ status: 'queued' });
  });

  router.post('/password-resets/complete', async (req, res) => {
    const { token, password } = parseInput(passwordResetCompleteSchema, req.body);
    await members.completePasswordReset(ctx, token, password);
    res.status(204).end();
  });

  router.get('/members', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const [rows, guild] = await Promise.all([members.listMembers(actor), loadGuild()]);
    res.json({ items: rows.map((m) => presentMemberRow(m, actor, guild, ctx.now())) });
  });

  router.patch('/members/:id', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const id = memberIdSchema.safeParse(req.params.id);
    if (!id.success) throw notFound('That member');
    const input = parseInput(memberUpdateSchema, req.body);
    const member = await members.updateMember(ctx, actor, id.data, input);
    res.json({ member: presentMemberRow(member, actor, await loadGuild(), ctx.now()) });
  });

  return router;
}
