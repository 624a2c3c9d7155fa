import { Router } from 'express';
import { reviewDecisionSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { presentBundle, presentReviewRow, sellerStats } from '../bundles/bundles.presenter.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { viewableBundle } from '../bundles/bundles.service.ts';
import { decide, reviewQueue } from './review.service.ts';

export function reviewRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/review-queue', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const queue = await reviewQueue(actor);
    const stats = await sellerStats(ctx.sequelize, queue.map((b) => b.seller!));
    res.json({ items: queue.map((b) => presentReviewRow(b, actor, { ...stats.get(b.sellerId)!, name: b.seller!.name }, ctx.storage)) });
  });

  router.post('/bundles/:id/review', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const id = routeId(req.params.id);
    const input = parseInput(reviewDecisionSchema, req.body);
    await decide(ctx, actor, id, input);
    const bundle = await viewableBundle(actor, id).catch(() => null);
    if (!bundle) return void res.json({ bundle: null });
    const stats = await sellerStats(ctx.sequelize, [bundle.seller!]);
    res.json({ bundle: presentBundle(bundle, actor, stats.get(bundle.sellerId)!, ctx.storage) });
  });

  return router;
}
