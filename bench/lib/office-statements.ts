/**
 * The statements the guild office's routes send, taken from the API's own
 * builders (dashboardStatement and monthStatementStatement in
 * apps/api/src/modules/office/), so the timings and plans the benchmark prints
 * are always those of the SQL the API runs, under the name it prepares it by.
 */
import { dashboardQuerySchema } from '@scrap-relay/shared';
import { dashboardStatement } from '../../apps/api/src/modules/office/dashboard.service.ts';
import { monthStatementStatement } from '../../apps/api/src/modules/office/reports.service.ts';
import type { NamedStatement } from '../../apps/api/src/db/named-statement.ts';

export interface OfficeStatement extends NamedStatement {
  /** The statement's opening words, whitespace folded, to tell statements apart in the output. */
  label: string;
}

const LABEL_LENGTH = 72;

function labelled(statement: NamedStatement): OfficeStatement {
  const folded = statement.text.replace(/\s+/g, ' ').trim();
  return { ...statement, label: `${statement.name}: ${folded.length > LABEL_LENGTH ? `${folded.slice(0, LABEL_LENGTH - 1)}…` : folded}` };
}

/** What GET /api/dashboard?<queryString> sends for a guild in `timeZone` (the same statement whether or not the member sees the money figures). */
export function dashboardStatements(queryString: string, now: Date, timeZone: string): OfficeStatement[] {
  const query = dashboardQuerySchema.parse(Object.fromEntries(new URLSearchParams(queryString)));
  return [labelled(dashboardStatement(query, now, timeZone).statement)];
}

/** What GET /api/reports/statement?month=<month> sends. */
export function statementStatements(month: string, timeZone: string): OfficeStatement[] {
  return [labelled(monthStatementStatement(month, timeZone))];
}
