import type pg from 'pg';
import type { Sequelize } from 'sequelize';

/**
 * A statement with a name. Its text never changes under that name and every input is a bind
 * parameter, so it is prepared once per database connection: PostgreSQL parses and analyses it
 * once per connection instead of once per request, and its plan cache (plan_cache_mode auto)
 * keeps a generic plan once one costs no more than the custom ones. Without a name it is an
 * unnamed statement, planned afresh for its values each time.
 */
export interface NamedStatement {
  name: string | undefined;
  text: string;
  values: unknown[];
}

/**
 * Runs a named statement on a connection of Sequelize's own pool. Sequelize sends every query
 * as an unnamed statement (parsed, analysed and planned again each time), so the pg client is
 * borrowed from the pool for the one query and handed straight back. The client carries
 * Sequelize's type parsers, so rows come back exactly as sequelize.query would return them.
 */
export async function runNamedStatement<Row extends object>(sequelize: Sequelize, statement: NamedStatement): Promise<Row[]> {
  const manager = sequelize.connectionManager;
  const client = (await manager.getConnection({ type: 'read' })) as pg.ClientBase;
  try {
    const { name, text, values } = statement;
    return (await client.query<Row>(name === undefined ? { text, values } : { name, text, values })).rows;
  } finally {
    manager.releaseConnection(client);
  }
}
