import { Router } from 'express';
import { wishSchema, type WishView } from '@scrap-relay/shared';
import type { Wish } from '../../db/models/index.ts';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { addWish, listWishes, removeWish } from './wishes.service.ts';

const presentWish = (w: Wish): WishView => ({ id: w.id, name: w.name, filters: w.filters as WishView['filters'], createdAt: w.createdAt.toISOString() });

export function wishesRoutes(): Router {
  const router = Router();

  router.get('/wishes', async (req, res) => {
    res.json({ items: (await listWishes(requireMember(req))).map(presentWish) });
  });

  router.post('/wishes', async (req, res) => {
    const member = requireMember(req);
    const input = parseInput(wishSchema, req.body);
    res.status(201).json({ wish: presentWish(await addWish(member, input)) });
  });

  router.delete('/wishes/:id', async (req, res) => {
    await removeWish(requireMember(req), routeId(req.params.id, 'That wish'));
    res.status(204).end();
  });

  return router;
}
