import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import { ledgerQuerySchema, payoutSchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { AMOUNT_COLUMN, decimalAmount, timeColumn, wallClockText } from './csv.ts';
import { ledgerEntries, recordPayout, sellerBalances } from './ledger.service.ts';

export function ledgerRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/ledger', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const query = parseInput(ledgerQuerySchema, req.query);
    const { items } = await ledgerEntries(ctx.sequelize, actor, query);
    res.json({ items });
  });

  /**
   * The same entries for the guild's books. Amounts are decimals in the currency's units (51.70, not 5170 cents),
   * with the currency beside them: a spreadsheet reads "5170" as five thousand dollars. Times are the guild's
   * wall-clock times, the days the filter chose them by, with the zone in the column's header.
   */
  router.get('/ledger.csv', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const query = parseInput(ledgerQuerySchema, req.query);
    const { items, timeZone } = await ledgerEntries(ctx.sequelize, actor, query);
    const csv = stringify(
      items.map((e) => [wallClockText(new Date(e.createdAt), timeZone), e.transactionId, e.kind, e.reverses ?? '', e.accountLabel, decimalAmount(e.amountMinor, e.currency), e.currency, e.orderReference ?? '', e.payoutId ?? '']),
      { header: true, columns: [timeColumn(timeZone), 'transaction', 'kind', 'reverses', 'account', AMOUNT_COLUMN, 'currency', 'order', 'payout'] },
    );
    res.type('text/csv').attachment(`scrap-relay-ledger${query.from ? `-${query.from}` : ''}.csv`).send(csv);
  });

  router.get('/seller-balances', async (req, res) => {
    const actor = actorOf(requireMember(req));
    res.json({ items: await sellerBalances(ctx.sequelize, actor) });
  });

  router.post('/payouts', async (req, res) => {
    const actor = actorOf(requireMember(req));
    const input = parseInput(payoutSchema, req.body);
    const payout = await recordPayout(ctx, actor, input);
    res.status(201).json({ payout: { id: payout.id, sellerId: payout.sellerId, amountMinor: payout.amountMinor, currency: payout.currency, method: payout.method, reference: payout.reference, createdAt: payout.createdAt.toISOString() } });
  });

  return router;
}
