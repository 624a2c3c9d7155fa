import { Router } from 'express';
import { stringify } from 'csv-stringify/sync';
import { dashboardQuerySchema, statementQuerySchema } from '@scrap-relay/shared';
import { requireMember } from '../../middleware/authenticate.ts';
import { parseInput } from '../../middleware/validate.ts';
import { authorize, can } from '../../policies/index.ts';
import type { AppContext } from '../../context.ts';
import { actorOf } from '../members/members.presenter.ts';
import { dashboardFigures, dashboardRows, guildPeriodBounds } from './dashboard.service.ts';
import { librarianReport, monthStatement } from './reports.service.ts';
import { AMOUNT_COLUMN, decimalAmount } from '../ledger/csv.ts';

export function officeRoutes(ctx: AppContext): Router {
  const router = Router();

  /** Every member sees what the exchange has done; the money figures only officers who see the ledger. */
  const figures = async (req: Parameters<typeof requireMember>[0]) => {
    const actor = actorOf(requireMember(req));
    const query = parseInput(dashboardQuerySchema, req.query);
    return dashboardFigures(ctx.sequelize, query, ctx.now(), can(actor, 'ledger.view'));
  };

  router.get('/dashboard', async (req, res) => {
    res.json({ figures: await figures(req) });
  });

  router.get('/dashboard.csv', async (req, res) => {
    const f = await figures(req);
    res.type('text/csv').attachment('scrap-relay-dashboard.csv').send(stringify(dashboardRows(f), { header: true, columns: ['figure', 'value'] }));
  });

  router.get('/reports/statement', async (req, res) => {
    authorize(actorOf(requireMember(req)), 'ledger.view');
    const { month } = parseInput(statementQuerySchema, req.query);
    res.json({ statement: await monthStatement(ctx.sequelize, month) });
  });

  router.get('/reports/statement.csv', async (req, res) => {
    authorize(actorOf(requireMember(req)), 'ledger.view');
    const { month } = parseInput(statementQuerySchema, req.query);
    const s = await monthStatement(ctx.sequelize, month);
    const amount = (minor: number) => [decimalAmount(minor, s.currency), s.currency];
    // Decimals in the currency's units with the currency beside them, as in the ledger's CSV.
    const rows = [
      ['charges', '', ...amount(s.chargesMinor)],
      ['guild_fees', '', ...amount(s.guildFeesMinor)],
      ['refunds', '', ...amount(s.refundsMinor)],
      ['processing_cost', '', ...amount(s.processingCostMinor)],
      ['disputes_lost', '', ...amount(s.disputesLostMinor)],
      ['dispute_fees', '', ...amount(s.disputeFeesMinor)],
      ['payouts', '', ...amount(s.payoutsMinor)],
      ['seller_credits', '', ...amount(s.sellerCreditsMinor)],
      ...s.closingBalances.map((b) => ['closing_balance', b.name, ...amount(b.balanceMinor)]),
      ['closing_balances_total', '', ...amount(s.closingBalancesTotalMinor)],
    ];
    res.type('text/csv').attachment(`scrap-relay-statement-${month}.csv`).send(stringify(rows, { header: true, columns: ['line', 'seller', AMOUNT_COLUMN, 'currency'] }));
  });

  router.get('/reports/librarian', async (req, res) => {
    authorize(actorOf(requireMember(req)), 'starter.manage');
    const query = parseInput(dashboardQuerySchema, req.query);
    const { from, to } = await guildPeriodBounds(query, ctx.now());
    res.json({ report: await librarianReport(ctx.sequelize, from, to, ctx.now()) });
  });

  return router;
}
