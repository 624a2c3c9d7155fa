import { Router } from 'express';
import { Op } from 'sequelize';
import { z } from 'zod';
import { meetingSchema, meetingUpdateSchema } from '@scrap-relay/shared';
import { Meeting } from '../../db/models/index.ts';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { authorize } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { presentMeeting } from '../orders/orders.presenter.ts';
import { createMeeting, updateMeeting } from './meetings.service.ts';

const listSchema = z.strictObject({ when: z.enum(['upcoming', 'all'], { error: 'Use when=upcoming or when=all.' }).default('upcoming') });

export function meetingsRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/meetings', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { when } = parseInput(listSchema, req.query);
    const meetings = await Meeting.findAll({
      where: when === 'upcoming' ? { startsAt: { [Op.gt]: ctx.now() } } : {},
      order: [['startsAt', when === 'upcoming' ? 'ASC' : 'DESC']],
      limit: 100,
    });
    res.json({ items: meetings.map((m) => presentMeeting(m, actor)) });
  });

  router.post('/meetings', async (req, res) => {
    const actor = actorOf(requireMember(req));
    authorize(actor, 'meeting.manage');
    const input = parseInput(meetingSchema, req.body);
    const meeting = await createMeeting(ctx, actor, input);
    res.status(201).json({ meeting: presentMeeting(meeting, actor) });
  });

  router.patch('/meetings/:id', async (req, res) => {
    const actor = actorOf(requireMember(req));
    authorize(actor, 'meeting.manage');
    const input = parseInput(meetingUpdateSchema, req.body);
    const meeting = await updateMeeting(ctx, actor, routeId(req.params.id, 'That meeting'), input);
    res.json({ meeting: presentMeeting(meeting, actor) });
  });

  return router;
}
