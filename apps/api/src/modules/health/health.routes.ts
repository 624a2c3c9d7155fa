import { Router } from 'express';
import type { AppContext } from '../../context.ts';
import { serviceUnavailable } from '../../errors/index.ts';

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    try {
      await ctx.sequelize.query('SELECT 1');
    } catch {
      throw serviceUnavailable('The database is not answering.');
    }
    res.json({ status: 'ok' });
  });
  return router;
}
