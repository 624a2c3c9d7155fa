/**
 * The statement the shelf route sends for one query string, built by the API's
 * own shelfStatement (apps/api/src/modules/bundles/shelf.query.ts), so the
 * plans the benchmark prints are always those of the SQL the API runs.
 */
import { shelfQuerySchema } from '@scrap-relay/shared';
import { shelfStatement } from '../../apps/api/src/modules/bundles/shelf.query.ts';

export interface Statement {
  /** What the statement answers: the page of bundles with the capped number of matches. */
  role: string;
  text: string;
  values: unknown[];
}

/** Parses the query string as the route does (defaults included) and returns what searchShelf would send. */
export async function shelfStatements(queryString: string): Promise<Statement[]> {
  const query = shelfQuerySchema.parse(Object.fromEntries(new URLSearchParams(queryString)));
  const { text, values } = shelfStatement(query);
  return [{ role: 'page and count', text, values }];
}
