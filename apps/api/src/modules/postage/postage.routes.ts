import { Router } from 'express';
import { allowsFulfilment, postageQuoteRequestSchema, postageTableSchema, type PostageQuoteView } from '@scrap-relay/shared';
import { Bundle } from '../../db/models/index.ts';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { notFound } from '../../errors/index.ts';
import { authorize, can } from '../../policies/index.ts';
import { actorOf } from '../members/members.presenter.ts';
import { loadGuild } from '../guild/guild.service.ts';
import { postageTableOf, quoteOrThrow, savePostageTable } from './postage.service.ts';

export function postageRoutes(): Router {
  const router = Router();

  router.get('/guild/postage', async (req, res) => {
    authorize(actorOf(requireMember(req)), 'postage.manage');
    res.json({ postage: postageTableOf(await loadGuild()) });
  });

  router.put('/guild/postage', async (req, res) => {
    authorize(actorOf(requireMember(req)), 'postage.manage');
    const table = parseInput(postageTableSchema, req.body);
    res.json({ postage: await savePostageTable(table) });
  });

  /** A quote for bundles on the shelf, to the viewer's own postal code, before anything is held. */
  router.post('/postage-quotes', async (req, res) => {
    const member = requireMember(req);
    const actor = actorOf(member);
    const input = parseInput(postageQuoteRequestSchema, req.body);
    const bundles = await Bundle.findAll({ where: { id: input.items.map((i) => i.bundleId) } });
    const byId = new Map(bundles.map((b) => [b.id, b]));
    const items = input.items.map((item, index) => {
      const bundle = byId.get(item.bundleId);
      if (!bundle || !can(actor, 'bundle.view', bundle) || !bundle.weightGrams) throw notFound(`Bundle ${index + 1}`);
      return { ref: bundle.title, grams: bundle.weightGrams, quantity: item.quantity, meetingHandover: allowsFulfilment(bundle, 'meeting') };
    });
    const guild = await loadGuild();
    const quote = quoteOrThrow(guild, items, input.destination, 'destination', member.units ?? guild.defaultUnits);
    const body: PostageQuoteView = { ...quote, currency: guild.currency };
    res.json(body);
  });

  return router;
}
