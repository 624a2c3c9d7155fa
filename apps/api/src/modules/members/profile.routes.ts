import { Router } from 'express';
import { postalAddressSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';

/** The member's own postal address, kept for the next posted order and shown only to the seller of a paid order. */
export function profileRoutes(): Router {
  const router = Router();
  router.get('/me/address', (req, res) => {
    res.json({ address: requireMember(req).postalAddress ?? null });
  });
  router.put('/me/address', async (req, res) => {
    const member = requireMember(req);
    const address = parseInput(postalAddressSchema, req.body);
    await member.update({ postalAddress: address });
    res.json({ address });
  });
  return router;
}
