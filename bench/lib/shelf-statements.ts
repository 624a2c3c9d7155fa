/**
 * The statements the shelf route sends for one query string, taken from the
 * API's own searchShelf (apps/api/src/modules/bundles/shelf.query.ts) by
 * handing it a recorder in place of Sequelize, so the plans the benchmark
 * prints are always those of the SQL the API runs.
 */
import type { Sequelize } from 'sequelize';
import { shelfQuerySchema } from '@scrap-relay/shared';
import { localStorage } from '../../apps/api/src/integrations/storage.ts';
import { searchShelf } from '../../apps/api/src/modules/bundles/shelf.query.ts';

export interface Statement {
  /** What the statement answers: the page of bundles with the capped number of matches. */
  role: string;
  text: string;
  values: unknown[];
}

/** Parses the query string as the route does (defaults included) and returns what searchShelf would send. */
export async function shelfStatements(queryString: string): Promise<Statement[]> {
  const query = shelfQuerySchema.parse(Object.fromEntries(new URLSearchParams(queryString)));
  const statements: Statement[] = [];
  const recorder = {
    // Answers every statement with no rows: searchShelf then returns an empty page, which is discarded.
    query: async (text: string, options: { bind?: unknown[] } = {}) => {
      statements.push({ role: 'page and count', text, values: options.bind ?? [] });
      return [];
    },
  };
  await searchShelf(recorder as unknown as Sequelize, localStorage('.'), query);
  return statements;
}
