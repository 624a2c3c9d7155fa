import { Op, QueryTypes } from 'sequelize';
import type { MemberHistory, ProfileUpdateInput } from '@scrap-relay/shared';
import { Bundle, Member, Order, StarterClaim, WaitlistEntry, Wish } from '../../db/models/index.ts';
import { hashPassword, verifyPassword } from '../../auth/passwords.ts';
import { newToken } from '../../auth/tokens.ts';
import { conflict, invalidCredentials } from '../../errors/index.ts';
import type { AppContext } from '../../context.ts';

const OPEN_ORDER_STATES = ['awaiting_payment', 'confirmed', 'posted'];

export function presentProfile(m: Member) {
  return { id: m.id, name: m.name, email: m.email, units: m.units, emailPreferences: m.emailPreferences, postalAddress: m.postalAddress ?? null, joinedAt: m.joinedAt.toISOString() };
}

export async function updateProfile(member: Member, input: ProfileUpdateInput): Promise<Member> {
  await member.update({
    ...(input.name !== undefined && { name: input.name }),
    ...(input.units !== undefined && { units: input.units }),
    ...(input.emailPreferences !== undefined && { emailPreferences: { ...member.emailPreferences, ...input.emailPreferences } }),
  });
  return member;
}

/** What the member passed on and received: whole units of paid orders and claims, by SQL aggregate. */
export async function memberHistory(ctx: AppContext, memberId: string): Promise<MemberHistory> {
  const [row] = await ctx.sequelize.query<{ given: number; given_grams: number; received: number; received_grams: number }>(
    `WITH units AS (
       SELECT o.seller_id AS giver, o.buyer_id AS taker, i.quantity AS n, i.quantity * i.weight_grams AS grams
       FROM order_items i JOIN orders o ON o.id = i.order_id WHERE o.state IN ('confirmed', 'posted', 'received', 'handed_over')
       UNION ALL
       SELECT b.seller_id, c.member_id, 1, b.weight_grams FROM starter_claims c JOIN bundles b ON b.id = c.bundle_id
       WHERE c.state <> 'cancelled' AND c.order_id IS NULL)
     SELECT coalesce(sum(n) FILTER (WHERE giver = $1), 0)::int AS given,
            coalesce(sum(grams) FILTER (WHERE giver = $1), 0)::int AS given_grams,
            coalesce(sum(n) FILTER (WHERE taker = $1), 0)::int AS received,
            coalesce(sum(grams) FILTER (WHERE taker = $1), 0)::int AS received_grams
     FROM units`,
    { bind: [memberId], type: QueryTypes.SELECT },
  );
  return { bundlesRehomed: row!.given, gramsPassedOn: row!.given_grams, bundlesReceived: row!.received, gramsReceived: row!.received_grams };
}

/** Everything the guild holds about the member, as one JSON document. */
export async function exportMemberData(ctx: AppContext, member: Member) {
  const [bundles, bought, sold, claims, wishes, waitlist] = await Promise.all([
    Bundle.findAll({ where: { sellerId: member.id }, include: [{ association: 'photos' }] }),
    Order.findAll({ where: { buyerId: member.id }, include: [{ association: 'items' }] }),
    Order.findAll({ where: { sellerId: member.id }, include: [{ association: 'items' }] }),
    StarterClaim.findAll({ where: { memberId: member.id } }),
    Wish.findAll({ where: { memberId: member.id } }),
    WaitlistEntry.findAll({ where: { memberId: member.id } }),
  ]);
  const plain = <T extends { toJSON(): object }>(rows: T[]) => rows.map((r) => r.toJSON());
  return {
    exportedAt: ctx.now().toISOString(),
    profile: { ...presentProfile(member), roles: member.roles, emailVerifiedAt: member.emailVerifiedAt },
    history: await memberHistory(ctx, member.id),
    bundles: plain(bundles),
    ordersAsBuyer: plain(bought),
    // The other party's address is theirs, not the seller's to download.
    ordersAsSeller: sold.map((o) => ({ ...o.toJSON(), address: null })),
    starterClaims: plain(claims),
    wishes: plain(wishes),
    waitlist: plain(waitlist),
  };
}

/**
 * Closes the account: personal data is removed or replaced, money records stay for the
 * guild's books (orders keep amounts and item titles, the ledger is untouched). Orders still
 * under way must finish first.
 */
export async function closeAccount(ctx: AppContext, member: Member, password: string): Promise<void> {
  if (!(await verifyPassword(member.passwordHash, password))) throw invalidCredentials();
  await ctx.sequelize.transaction(async (transaction) => {
    const open = await Order.count({ where: { [Op.or]: [{ buyerId: member.id }, { sellerId: member.id }], state: OPEN_ORDER_STATES }, transaction });
    if (open > 0) throw conflict('Some of your orders are still under way. Close the account once they are received or cancelled.', { orders: `${open} still open.` });
    await Bundle.update({ state: 'withdrawn' }, { where: { sellerId: member.id, state: ['draft', 'in_review', 'on_shelf', 'returned', 'expired'] }, transaction });
    await Wish.destroy({ where: { memberId: member.id }, transaction });
    await WaitlistEntry.update({ status: 'left' }, { where: { memberId: member.id, status: ['waiting', 'offered'] }, transaction });
    await Order.update({ address: null }, { where: { buyerId: member.id }, transaction });
    await member.update(
      {
        name: 'Former member',
        email: `closed-${member.id}@closed.scrap-relay.invalid`,
        passwordHash: await hashPassword(newToken()),
        postalAddress: null,
        active: false,
        roles: ['member'],
        emailPreferences: {},
        closedAt: ctx.now(),
      },
      { transaction },
    );
    await ctx.sequelize.query(`DELETE FROM session WHERE sess->'passport'->>'user' = $1`, { bind: [member.id], transaction });
    await ctx.sequelize.query(`DELETE FROM member_tokens WHERE member_id = $1`, { bind: [member.id], transaction });
  });
}
