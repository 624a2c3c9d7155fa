/**
 * The statements the guild office's routes send, taken from the API's own
 * dashboardFigures and monthStatement (apps/api/src/modules/office/) by
 * handing them a recorder in place of Sequelize, so the timings and plans the
 * benchmark prints are always those of the SQL the API runs.
 */
import type { Sequelize } from 'sequelize';
import { dashboardQuerySchema } from '@scrap-relay/shared';
import type { Guild } from '../../apps/api/src/db/models/index.ts';
import { dashboardFigures } from '../../apps/api/src/modules/office/dashboard.service.ts';
import { monthStatement } from '../../apps/api/src/modules/office/reports.service.ts';

export interface OfficeStatement {
  /** The statement's opening words, whitespace folded, to tell statements apart in the output. */
  label: string;
  text: string;
  values: unknown[];
}

const LABEL_LENGTH = 72;

function recorder(statements: OfficeStatement[]): Sequelize {
  return {
    // One empty row answers every statement: the services read row 0 of single-row results, and what they build is discarded.
    query: async (text: string, options: { bind?: unknown[] } = {}) => {
      const folded = text.replace(/\s+/g, ' ').trim();
      statements.push({ label: folded.length > LABEL_LENGTH ? `${folded.slice(0, LABEL_LENGTH - 1)}…` : folded, text, values: options.bind ?? [] });
      return [{}];
    },
  } as unknown as Sequelize;
}

/** Only the currency is read from the guild by either service. */
const guildStandIn = (currency: string) => ({ currency }) as Guild;

/** What GET /api/dashboard?<queryString> sends for a member who may see the ledger (the money figures included). */
export async function dashboardStatements(queryString: string, now: Date, currency: string): Promise<OfficeStatement[]> {
  const query = dashboardQuerySchema.parse(Object.fromEntries(new URLSearchParams(queryString)));
  const statements: OfficeStatement[] = [];
  await dashboardFigures(recorder(statements), guildStandIn(currency), query, now, true);
  return statements;
}

/** What GET /api/reports/statement?month=<month> sends. */
export async function statementStatements(month: string, currency: string): Promise<OfficeStatement[]> {
  const statements: OfficeStatement[] = [];
  await monthStatement(recorder(statements), guildStandIn(currency), month);
  return statements;
}
