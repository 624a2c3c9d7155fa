import type pg from 'pg';
import type { Sequelize } from 'sequelize';

/**
 * One statement of the guild office, with a name. Its text never changes and every input is a
 * bind parameter, so it is prepared once per database connection under that name: PostgreSQL
 * parses and analyses it once per connection instead of once per request, and its plan cache
 * (plan_cache_mode auto) keeps a generic plan once one costs no more than the custom ones.
 */
export interface OfficeStatement {
  name: string;
  text: string;
  values: unknown[];
}

/**
 * Runs a named statement on a connection of Sequelize's own pool. Sequelize sends every query
 * as an unnamed statement (parsed, analysed and planned again each time), so the pg client is
 * borrowed from the pool for the one query and handed straight back. The client carries
 * Sequelize's type parsers, so rows come back exactly as sequelize.query would return them.
 */
export async function runOfficeStatement<Row extends object>(sequelize: Sequelize, statement: OfficeStatement): Promise<Row[]> {
  const manager = sequelize.connectionManager;
  const client = (await manager.getConnection({ type: 'read' })) as pg.ClientBase;
  try {
    return (await client.query<Row>({ name: statement.name, text: statement.text, values: statement.values })).rows;
  } finally {
    manager.releaseConnection(client);
  }
}
