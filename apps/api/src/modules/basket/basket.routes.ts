import { Router } from 'express';
import { basketAddSchema, basketQuantitySchema } from '@scrap-relay/shared';
import type { AppContext } from '../../context.ts';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { addToBasket, basketOf, removeFromBasket, setBasketQuantity } from './basket.service.ts';

/** The signed-in member's basket. Every change answers with the whole basket, so a device shows what the server holds. */
export function basketRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/basket', async (req, res) => {
    res.json({ basket: await basketOf(requireMember(req).id) });
  });

  router.post('/basket/items', async (req, res) => {
    const member = requireMember(req);
    res.json({ basket: await addToBasket(ctx.sequelize, member, parseInput(basketAddSchema, req.body)) });
  });

  router.patch('/basket/items/:bundleId', async (req, res) => {
    const member = requireMember(req);
    const bundleId = routeId(req.params.bundleId, 'That bundle in your basket');
    const { quantity } = parseInput(basketQuantitySchema, req.body);
    res.json({ basket: await setBasketQuantity(member, bundleId, quantity) });
  });

  router.delete('/basket/items/:bundleId', async (req, res) => {
    const member = requireMember(req);
    await removeFromBasket(member, [routeId(req.params.bundleId, 'That bundle in your basket')]);
    res.json({ basket: await basketOf(member.id) });
  });

  return router;
}
