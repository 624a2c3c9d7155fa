import { Router, type Request } from 'express';
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
import { notFound } from '../../errors/index.ts';
import type { AppContext } from '../../context.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { actorOf, presentMemberRow, presentSessionUser } from './members.presenter.ts';
import * as members from './members.service.ts';

const memberIdSchema = z.uuid({ error: 'Not a member id.' });

const logIn = (req: Request, member: Member) =>
  new Promise<void>((resolve, reject) => req.login(member, (err) => (err ? reject(err) : resolve())));

export function membersRoutes(ctx: AppContext): Router {
  const router = Router();

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

  router.post('/email-verifications/resend', async (req, res) => {
    await members.resendVerification(ctx, requireMember(req));
    res.status(202).json({ status: 'queued' });
  });

  router.post('/password-resets', async (req, res) => {
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
