import { Router } from 'express';
import { closeAccountSchema, postalAddressSchema, profileUpdateSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import type { AppContext } from '../../context.ts';
import { closeAccount, exportMemberData, memberHistory, presentProfile, updateProfile } from './profile.service.ts';

/** The member's own profile: name, units, e-mail choices, postal address (shown only to the seller of a paid order), history, data and closing. */
export function profileRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/me', (req, res) => {
    res.json({ profile: presentProfile(requireMember(req)) });
  });

  router.patch('/me', async (req, res) => {
    const member = requireMember(req);
    const input = parseInput(profileUpdateSchema, req.body);
    res.json({ profile: presentProfile(await updateProfile(member, input)) });
  });

  router.get('/me/address', (req, res) => {
    res.json({ address: requireMember(req).postalAddress ?? null });
  });

  router.put('/me/address', async (req, res) => {
    const member = requireMember(req);
    const address = parseInput(postalAddressSchema, req.body);
    await member.update({ postalAddress: address });
    res.json({ address });
  });

  router.get('/me/history', async (req, res) => {
    res.json({ history: await memberHistory(ctx, requireMember(req).id) });
  });

  router.get('/me/export', async (req, res) => {
    const data = await exportMemberData(ctx, requireMember(req));
    res.attachment('my-scrap-relay-data.json').json(data);
  });

  router.post('/me/close', async (req, res) => {
    const member = requireMember(req);
    const { password } = parseInput(closeAccountSchema, req.body);
    await closeAccount(ctx, member, password);
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    res.clearCookie('sr.sid');
    res.status(204).end();
  });

  return router;
}
