import { Op, UniqueConstraintError } from 'sequelize';
import type { JoinInput, MemberUpdateInput } from '@scrap-relay/shared';
import { Member, MemberToken, type TokenPurposeType } from '../../db/models/index.ts';
import { hashPassword } from '../../auth/passwords.ts';
import { hashToken, newToken } from '../../auth/tokens.ts';
import { emailTaken, forbidden, invalidInviteCode, invalidToken, notFound } from '../../errors/index.ts';
import { passwordReset, verifyEmail } from '../../emails/account.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { inviteCodeMatches, loadGuild } from '../guild/guild.service.ts';

const HOUR_MS = 60 * 60 * 1000;
const TOKEN_LIFETIME_MS: Record<TokenPurposeType, number> = { email_verification: 48 * HOUR_MS, password_reset: HOUR_MS };

async function issueToken(ctx: AppContext, member: Member, purpose: TokenPurposeType, transaction?: import('sequelize').Transaction) {
  const token = newToken();
  await MemberToken.create(
    { memberId: member.id, purpose, tokenHash: hashToken(token), expiresAt: new Date(ctx.now().getTime() + TOKEN_LIFETIME_MS[purpose]), usedAt: null },
    { transaction },
  );
  return token;
}

/** Spends a single-use token: valid, unexpired and unused, or a 400. Locks the row so two clicks cannot both spend it. */
async function spendToken(ctx: AppContext, token: string, purpose: TokenPurposeType, transaction: import('sequelize').Transaction) {
  const row = await MemberToken.findOne({ where: { tokenHash: hashToken(token), purpose }, transaction, lock: transaction.LOCK.UPDATE });
  if (!row || row.usedAt || row.expiresAt <= ctx.now()) throw invalidToken();
  await row.update({ usedAt: ctx.now() }, { transaction });
  const member = await Member.findByPk(row.memberId, { transaction });
  if (!member) throw invalidToken();
  return member;
}

export async function joinGuild(ctx: AppContext, input: JoinInput): Promise<Member> {
  const guild = await loadGuild();
  if (!inviteCodeMatches(guild, input.inviteCode)) throw invalidInviteCode();
  const passwordHash = await hashPassword(input.password);
  try {
    return await ctx.sequelize.transaction(async (transaction) => {
      const member = await Member.create(
        { name: input.name, email: input.email, passwordHash, emailVerifiedAt: null, units: null, joinedAt: ctx.now() },
        { transaction },
      );
      const token = await issueToken(ctx, member, 'email_verification', transaction);
      const mail = verifyEmail({ guildName: guild.name, name: member.name, link: `${ctx.config.appUrl}/verify-email?token=${token}` });
      await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
      return member;
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw emailTaken();
    throw err;
  }
}

export async function verifyEmailAddress(ctx: AppContext, token: string): Promise<Member> {
  return ctx.sequelize.transaction(async (transaction) => {
    const member = await spendToken(ctx, token, 'email_verification', transaction);
    if (!member.emailVerifiedAt) await member.update({ emailVerifiedAt: ctx.now() }, { transaction });
    return member;
  });
}

export async function resendVerification(ctx: AppContext, member: Member): Promise<void> {
  if (member.emailVerifiedAt) return;
  const guild = await loadGuild();
  await ctx.sequelize.transaction(async (transaction) => {
    const token = await issueToken(ctx, member, 'email_verification', transaction);
    const mail = verifyEmail({ guildName: guild.name, name: member.name, link: `${ctx.config.appUrl}/verify-email?token=${token}` });
    await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
  });
}

/** Always succeeds from the outside, so the form cannot be used to learn who is a member. */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  const member = await Member.findOne({ where: { email } });
  if (!member || !member.active) return;
  const guild = await loadGuild();
  await ctx.sequelize.transaction(async (transaction) => {
    const token = await issueToken(ctx, member, 'password_reset', transaction);
    const mail = passwordReset({ guildName: guild.name, name: member.name, link: `${ctx.config.appUrl}/reset-password?token=${token}` });
    await ctx.queue.enqueueEmail({ to: member.email, ...mail }, transaction);
  });
}

/** Sets the new password, spends every open reset link and signs the member out everywhere. */
export async function completePasswordReset(ctx: AppContext, token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await ctx.sequelize.transaction(async (transaction) => {
    const member = await spendToken(ctx, token, 'password_reset', transaction);
    await member.update({ passwordHash, emailVerifiedAt: member.emailVerifiedAt ?? ctx.now() }, { transaction });
    await MemberToken.update(
      { usedAt: ctx.now() },
      { where: { memberId: member.id, purpose: 'password_reset', usedAt: { [Op.is]: null } }, transaction },
    );
    await ctx.sequelize.query(`DELETE FROM session WHERE sess->'passport'->>'user' = $1`, { bind: [member.id], transaction });
  });
}

export async function listMembers(actor: Actor): Promise<Member[]> {
  authorize(actor, 'member.list');
  return Member.findAll({ order: [['name', 'ASC']] });
}

export async function updateMember(ctx: AppContext, actor: Actor, memberId: string, input: MemberUpdateInput): Promise<Member> {
  return ctx.sequelize.transaction(async (transaction) => {
    const member = await Member.findByPk(memberId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!member) throw notFound('That member');
    if (input.roles !== undefined) {
      authorize(actor, 'member.changeRoles', member);
      if (member.id === actor.id && !input.roles.includes('admin')) throw forbidden('You cannot remove your own admin role; ask another admin.');
    }
    if (input.active !== undefined) authorize(actor, 'member.deactivate', member);
    if (input.newQuilterFlag !== undefined) authorize(actor, 'member.flagNewQuilter', member);
    await member.update(
      {
        ...(input.roles !== undefined && { roles: [...new Set(input.roles)] }),
        ...(input.active !== undefined && { active: input.active }),
        ...(input.newQuilterFlag !== undefined && { newQuilterFlag: input.newQuilterFlag }),
      },
      { transaction },
    );
    if (input.active === false) {
      await ctx.sequelize.query(`DELETE FROM session WHERE sess->'passport'->>'user' = $1`, { bind: [member.id], transaction });
    }
    return member;
  });
}
