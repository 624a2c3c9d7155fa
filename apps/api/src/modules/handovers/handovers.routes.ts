import { Router } from 'express';
import { handoverMoveSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { presentMeeting } from '../orders/orders.presenter.ts';
import { cancelHandover, handoverMeetingId, handoverSheet, markHandover, moveOpenHandovers } from './handovers.service.ts';

export function handoversRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/meetings/:id/handovers', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { meeting, handovers } = await handoverSheet(ctx, actor, routeId(req.params.id, 'That meeting'));
    res.json({ meeting: presentMeeting(meeting, actor), items: handovers });
  });

  router.post('/meetings/:id/handovers/move', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { toMeetingId } = parseInput(handoverMoveSchema, req.body);
    const moved = await moveOpenHandovers(ctx, actor, routeId(req.params.id, 'That meeting'), toMeetingId);
    res.json({ moved });
  });

  router.get('/handovers/:id', async (req, res) => {
    const meetingId = await handoverMeetingId(actorOf(requireMember(req)), routeId(req.params.id, 'That handover'));
    res.json({ meetingId });
  });

  router.post('/handovers/:id/done', async (req, res) => {
    await markHandover(ctx, actorOf(requireMember(req)), routeId(req.params.id, 'That handover'), true);
    res.status(204).end();
  });

  router.delete('/handovers/:id/done', async (req, res) => {
    await markHandover(ctx, actorOf(requireMember(req)), routeId(req.params.id, 'That handover'), false);
    res.status(204).end();
  });

  router.post('/handovers/:id/cancel', async (req, res) => {
    await cancelHandover(ctx, actorOf(requireMember(req)), routeId(req.params.id, 'That handover'));
    res.status(204).end();
  });

  return router;
}
