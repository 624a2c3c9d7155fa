import { Router, type Request } from 'express';
import { z } from 'zod';
import QRCode from 'qrcode';
import { orderCancelSchema, orderCreateSchema, orderPostedSchema, orderProblemSchema, type OrderView } from '@scrap-relay/shared';
import { BundlePhoto, type Order } from '../../db/models/index.ts';
import { requireMember, requireVerifiedMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { authorize, type Actor } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { routeId } from '../bundles/bundles.routes.ts';
import { refundEffects } from '../ledger/ledger.service.ts';
import { presentOrder } from './orders.presenter.ts';
import * as orders from './orders.service.ts';
import { ordersWithOpenDisputes } from './disputes.service.ts';

const listQuerySchema = z
  .strictObject({
    as: z.enum(['buyer', 'seller', 'treasurer'], { error: 'Use as=buyer, as=seller or as=treasurer.' }).default('buyer'),
    problems: z.enum(['open'], { error: 'Use problems=open.' }).optional(),
    disputes: z.enum(['open'], { error: 'Use disputes=open.' }).optional(),
  })
  .refine((q) => !q.disputes || (q.as === 'treasurer' && !q.problems), {
    error: 'Disputes are listed for the treasurer on their own: as=treasurer&disputes=open.',
    path: ['disputes'],
  });

async function firstThumbs(ctx: AppContext, list: Order[]): Promise<Map<string, string | null>> {
  const bundleIds = [...new Set(list.flatMap((o) => (o.items ?? []).map((i) => i.bundleId)))];
  if (bundleIds.length === 0) return new Map();
  const photos = await BundlePhoto.findAll({ where: { bundleId: bundleIds, position: 0 } });
  return new Map(photos.map((p) => [p.bundleId, ctx.storage.publicUrl(p.thumbKey)]));
}

/** Presents a list of orders with what they need from other tables, read once for the whole list. */
async function presentOrders(ctx: AppContext, actor: Actor, list: Order[]): Promise<OrderView[]> {
  const [thumbs, effects] = await Promise.all([firstThumbs(ctx, list), refundEffects(ctx.sequelize, actor, list)]);
  return list.map((o) => presentOrder(o, actor, { thumbs, refundEffects: effects }));
}

export function ordersRoutes(ctx: AppContext): Router {
  const router = Router();

  const present = async (req: Request, id: string) => {
    const actor = actorOf(requireMember(req));
    const [view] = await presentOrders(ctx, actor, [await orders.viewableOrder(actor, id)]);
    return view!;
  };

  router.post('/orders', async (req, res) => {
    const buyer = requireVerifiedMember(req);
    const input = parseInput(orderCreateSchema, req.body);
    const order = await orders.placeOrder(ctx, buyer, input);
    const view = await present(req, order.id);
    res.status(201).json({ order: view, checkoutUrl: view.checkoutUrl });
  });

  router.get('/orders', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { as, problems, disputes } = parseInput(listQuerySchema, req.query);
    const list = disputes
      ? await ordersWithOpenDisputes(actor)
      : as === 'treasurer'
        ? await orders.ordersWithOpenProblems(actor, problems === 'open')
        : await orders.listOrders(actor, as);
    res.json({ items: await presentOrders(ctx, actor, list) });
  });

  router.get('/orders/:id', async (req, res) => {
    res.json({ order: await present(req, routeId(req.params.id, 'That order')) });
  });

  /** The seller's packing slip: addresses, items and a QR code of the order reference. */
  router.get('/orders/:id/packing-slip', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const id = routeId(req.params.id, 'That order');
    const order = await orders.viewableOrder(actor, id);
    authorize(actor, 'order.viewAddress', order);
    const [view] = await presentOrders(ctx, actor, [order]);
    const qrSvg = await QRCode.toString(order.reference, { type: 'svg', margin: 1, errorCorrectionLevel: 'M' });
    res.json({ order: view, qrSvg });
  });

  router.post('/orders/:id/posted', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { trackingNumber } = parseInput(orderPostedSchema, req.body);
    const order = await orders.markPosted(ctx, actor, routeId(req.params.id, 'That order'), trackingNumber);
    res.json({ order: await present(req, order.id) });
  });

  router.post('/orders/:id/received', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const order = await orders.markReceived(ctx, actor, routeId(req.params.id, 'That order'));
    res.json({ order: await present(req, order.id) });
  });

  router.post('/orders/:id/cancel', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { reason } = parseInput(orderCancelSchema, req.body);
    const order = await orders.cancelOrder(ctx, actor, routeId(req.params.id, 'That order'), reason);
    res.json({ order: await present(req, order.id) });
  });

  router.post('/orders/:id/refund', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const order = await orders.refundOrder(ctx, actor, routeId(req.params.id, 'That order'));
    res.json({ order: await present(req, order.id) });
  });

  router.post('/orders/:id/problems', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const { message } = parseInput(orderProblemSchema, req.body);
    const id = routeId(req.params.id, 'That order');
    await orders.reportProblem(ctx, actor, id, message);
    res.status(201).json({ order: await present(req, id) });
  });

  return router;
}
