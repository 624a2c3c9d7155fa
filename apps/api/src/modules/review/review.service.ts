import { QueryTypes } from 'sequelize';
import type { ReviewDecisionInput } from '@scrap-relay/shared';
import { Bundle, BundleReview, Member } from '../../db/models/index.ts';
import { bundleApproved, starterBundleApproved, bundleReturned, wishMatched } from '../../emails/bundles.ts';
import { emailChoicesUrl } from '../../emails/render.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { findBundle } from '../bundles/bundles.service.ts';
import { WISH_MATCH_SQL, type WishMatch } from '../wishes/wishes.service.ts';
import { offerToNextInLine } from '../starter/starter.service.ts';

const DAY_MS = 24 * 60 * 60 * 1000;

export async function reviewQueue(actor: Actor): Promise<Bundle[]> {
  authorize(actor, 'bundle.reviewQueue');
  return Bundle.findAll({
    where: { state: 'in_review' },
    include: [{ association: 'photos' }, { association: 'seller' }],
    order: [
      ['submittedAt', 'ASC'],
      ['photos', 'position', 'ASC'],
    ],
  });
}

/**
 * Approve → on the shelf until the guild's limit, the seller is told, and every member with
 * matching wishes (not the seller) gets one e-mail naming them; return → back to the seller with the notes.
 * Everything, e-mails included, is queued in the one transaction.
 */
export async function decide(ctx: AppContext, librarian: Actor, bundleId: string, input: ReviewDecisionInput): Promise<Bundle> {
  const guild = await loadGuild();
  return ctx.sequelize.transaction(async (transaction) => {
    const bundle = await findBundle(bundleId, transaction, true);
    authorize(librarian, 'bundle.review', bundle);
    const seller = (await Member.findByPk(bundle.sellerId, { transaction }))!;
    const now = ctx.now();
    const link = `${ctx.config.appUrl}/bundles/${bundle.id}`;
    const choicesLink = emailChoicesUrl(ctx.config.appUrl);
    await BundleReview.create({ bundleId, reviewerId: librarian.id, decision: input.decision, notes: input.notes ?? null }, { transaction });

    if (input.decision === 'return') {
      await bundle.update({ state: 'returned', reviewNotes: input.notes ?? '', reviewedAt: now }, { transaction });
      const mail = bundleReturned({ guildName: guild.name, name: seller.name, title: bundle.title, link: `${ctx.config.appUrl}/my-bundles/${bundle.id}/edit`, notes: input.notes ?? '', choicesLink });
      await ctx.queue.enqueueEmail({ to: seller.email, kind: 'review', ...mail }, transaction);
      return bundle;
    }

    await bundle.update(
      {
        state: 'on_shelf',
        reviewNotes: input.notes ?? null,
        reviewedAt: now,
        onShelfAt: now,
        expiresAt: new Date(now.getTime() + guild.settings.shelfLimitDays * DAY_MS),
      },
      { transaction },
    );
    const approved = bundle.offer === 'starter' ? starterBundleApproved : bundleApproved;
    await ctx.queue.enqueueEmail({ to: seller.email, kind: 'review', ...approved({ guildName: guild.name, name: seller.name, title: bundle.title, link, choicesLink }) }, transaction);

    // A starter bundle goes first to whoever has waited longest.
    if (bundle.offer === 'starter') await offerToNextInLine(ctx, bundle.id, transaction);

    const matches = await ctx.sequelize.query<WishMatch>(WISH_MATCH_SQL, { bind: [bundle.id], transaction, type: QueryTypes.SELECT });
    for (const match of matches) {
      const mail = wishMatched({ guildName: guild.name, name: match.member_name, title: bundle.title, link, wishNames: match.wish_names, choicesLink });
      await ctx.queue.enqueueEmail({ to: match.member_email, kind: 'wishes', ...mail }, transaction);
    }
    return bundle;
  });
}
