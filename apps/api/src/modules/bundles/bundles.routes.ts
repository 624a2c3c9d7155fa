import { Router, type Request } from 'express';
import { z } from 'zod';
import { bundleDraftSchema, estimateYield, planBundle, shelfQuerySchema, yieldRequestSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { photoUpload } from '../../middleware/upload.ts';
import { notFound } from '../../errors/index.ts';
import type { AppContext } from '../../context.ts';
import { actorOf, newQuilterStatus } from '../members/members.presenter.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { presentBundle, sellerStats } from './bundles.presenter.ts';
import * as bundles from './bundles.service.ts';
import { shelfPageBody } from './shelf-pages.ts';

const idSchema = z.uuid();
export const routeId = (value: unknown, what = 'That bundle') => {
  const parsed = idSchema.safeParse(value);
  if (!parsed.success) throw notFound(what);
  return parsed.data;
};

const reorderSchema = z.strictObject({ photoIds: z.array(z.uuid({ error: 'Not a photo id.' })).min(1).max(8) });

export function bundlesRoutes(ctx: AppContext): Router {
  const router = Router();

  /** Re-reads the bundle with its photos and seller, and presents it for the signed-in viewer. */
  const present = async (req: Request, id: string) => {
    const member = requireMember(req);
    const actor = { ...actorOf(member), newQuilter: newQuilterStatus(member, await loadGuild(), ctx.now()) };
    const bundle = await bundles.viewableBundle(actor, id);
    const stats = await sellerStats(ctx.sequelize, [bundle.seller!]);
    return presentBundle(bundle, actor, stats.get(bundle.sellerId)!, ctx.storage);
  };

  router.get('/bundles', async (req, res) => {
    requireMember(req);
    const query = parseInput(shelfQuerySchema, req.query);
    const { body, etag } = await shelfPageBody(ctx, query, (text) => req.app.get('etag fn')?.(text, 'utf8'));
    if (etag !== null) res.set('ETag', etag);
    res.type('json').send(body);
  });

  router.get('/bundles/mine', async (req, res) => {
    const member = requireMember(req);
    const actor = actorOf(member);
    const own = await bundles.listOwnBundles(member);
    const stats = await sellerStats(ctx.sequelize, [member]);
    res.json({ items: own.map((b) => presentBundle(b, actor, stats.get(member.id)!, ctx.storage)) });
  });

  router.post('/bundles', async (req, res) => {
    const member = requireMember(req);
    const input = parseInput(bundleDraftSchema, req.body);
    const bundle = await bundles.createDraft(ctx, member, input);
    res.status(201).json({ bundle: await present(req, bundle.id) });
  });

  router.get('/bundles/:id', async (req, res) => {
    const member = requireMember(req);
    res.json({ bundle: await present(req, routeId(req.params.id)) });
  });

  router.patch('/bundles/:id', async (req, res) => {
    const member = requireMember(req);
    const id = routeId(req.params.id);
    const input = parseInput(bundleDraftSchema, req.body);
    const bundle = await bundles.updateDraft(ctx, member, id, input);
    res.json({ bundle: await present(req, bundle.id) });
  });

  router.post('/bundles/:id/photos', async (req, res) => {
    const member = requireMember(req);
    const id = routeId(req.params.id);
    await new Promise<void>((resolve, reject) => photoUpload()(req, res, (err?: unknown) => (err ? reject(err) : resolve())));
    const files = (req.files as Express.Multer.File[] | undefined) ?? [];
    await bundles.addPhotos(ctx, member, id, files);
    res.status(201).json({ bundle: await present(req, id) });
  });

  router.put('/bundles/:id/photos/order', async (req, res) => {
    const member = requireMember(req);
    const id = routeId(req.params.id);
    const { photoIds } = parseInput(reorderSchema, req.body);
    await bundles.reorderPhotos(ctx, member, id, photoIds);
    res.json({ bundle: await present(req, id) });
  });

  router.delete('/bundles/:id/photos/:photoId', async (req, res) => {
    const member = requireMember(req);
    const id = routeId(req.params.id);
    await bundles.removePhoto(ctx, member, id, routeId(req.params.photoId, 'That photo'));
    res.json({ bundle: await present(req, id) });
  });

  router.post('/bundles/:id/submit', async (req, res) => {
    const member = requireMember(req);
    const bundle = await bundles.submitForReview(ctx, member, routeId(req.params.id));
    res.json({ bundle: await present(req, bundle.id) });
  });

  router.post('/bundles/:id/withdraw', async (req, res) => {
    const member = requireMember(req);
    const bundle = await bundles.withdraw(ctx, member, routeId(req.params.id));
    res.json({ bundle: await present(req, bundle.id) });
  });

  router.post('/estimates/yield', async (req, res) => {
    requireMember(req);
    const input = parseInput(yieldRequestSchema, req.body);
    res.json({
      yield: estimateYield({ grams: input.weightGrams, fibre: input.fibre }),
      cutPlan: input.pieces?.length ? planBundle(input.pieces) : null,
    });
  });

  return router;
}
