import { Router, type Request } from 'express';
import { starterClaimSchema, waitlistRemovalSchema } from '@scrap-relay/shared';
import { requireVerifiedMember, requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { authorize } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { presentBundle, sellerStats } from '../bundles/bundles.presenter.ts';
import * as starter from './starter.service.ts';
import type { StarterClaim } from '../../db/models/index.ts';

const presentClaim = (c: StarterClaim) => ({ id: c.id, bundleId: c.bundleId, meetingId: c.meetingId, state: c.state, claimedAt: c.claimedAt.toISOString() });

export function starterRoutes(ctx: AppContext): Router {
  const router = Router();

  /** What is free now; only new quilters who may claim see the list, others are told why not. */
  router.get('/starter-bundles', async (req, res) => {
    const member = requireVerifiedMember(req);
    const status = await starter.myStarterStatus(ctx, member);
    const actor = { ...actorOf(member), newQuilter: status.eligibility.eligible || status.eligibility.reason === 'over_limit' };
    const bundles = status.eligibility.eligible ? await starter.availableStarterBundles() : [];
    const stats = await sellerStats(ctx.sequelize, bundles.map((b) => b.seller!));
    res.json({ status, items: bundles.map((b) => presentBundle(b, actor, stats.get(b.sellerId)!, ctx.storage)) });
  });

  router.post('/starter-bundles/:id/claims', async (req, res) => {
    const member = requireVerifiedMember(req);
    const { meetingId } = parseInput(starterClaimSchema, req.body);
    const claim = await starter.claimStarterBundle(ctx, member.id, routeId(req.params.id, 'That starter bundle'), meetingId);
    res.status(201).json({ claim: presentClaim(claim) });
  });

  router.get('/waitlist', async (req, res) => {
    authorize(actorOf(requireMember(req)), 'starter.manage');
    res.json({ items: await starter.waitlistQueue(ctx.sequelize, ctx.now()) });
  });

  router.post('/waitlist', async (req: Request, res) => {
    const member = requireVerifiedMember(req);
    parseInput(starterClaimSchema.pick({}), req.body);
    const entry = await starter.joinWaitlist(ctx, member.id);
    res.status(201).json({ entry: { id: entry.id, status: entry.status, joinedAt: entry.joinedAt.toISOString() } });
  });

  router.delete('/waitlist/me', async (req, res) => {
    const member = requireMember(req);
    await starter.leaveWaitlist(ctx, member.id);
    res.status(204).end();
  });

  router.delete('/waitlist/:entryId', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { reason } = parseInput(waitlistRemovalSchema, req.body);
    await starter.leaveWaitlist(ctx, actor.id, { by: actor, reason, entryId: routeId(req.params.entryId, 'That place on the waiting list') });
    res.status(204).end();
  });

  router.post('/waitlist/offers/:id/accept', async (req, res) => {
    const member = requireVerifiedMember(req);
    const { meetingId } = parseInput(starterClaimSchema, req.body);
    const claim = await starter.acceptOffer(ctx, member.id, routeId(req.params.id, 'That offer'), meetingId);
    res.status(201).json({ claim: presentClaim(claim) });
  });

  router.post('/waitlist/offers/:id/decline', async (req, res) => {
    const member = requireVerifiedMember(req);
    await starter.declineOffer(ctx, member.id, routeId(req.params.id, 'That offer'));
    res.status(204).end();
  });

  return router;
}
