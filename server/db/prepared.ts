/**
 * A statement prepared once per connection, for the reads every request makes (the session lookup, a plan
 * by id). Knex builds the SQL text and prepares a fresh statement on every call; for a lookup that runs on
 * every request that is most of the cost. The connection still comes from Knex's pool, so the read waits
 * for an open transaction like any other query and never sees its uncommitted rows.
 */
import type { Database as Sqlite, Statement } from 'better-sqlite3';
import type { Database } from './database';

type Param = string | number | bigint | Buffer | null;

export interface PreparedRead<Row> {
  get(...params: Param[]): Promise<Row | undefined>;
}

export function preparedRead<Row>(db: Database, sql: string): PreparedRead<Row> {
  const statements = new WeakMap<Sqlite, Statement<Param[], Row>>();
  return {
    async get(...params) {
      const connection = (await db.client.acquireConnection()) as Sqlite;
      try {
        let statement = statements.get(connection);
        if (!statement) {
          statement = connection.prepare<Param[], Row>(sql);
          statements.set(connection, statement);
        }
        return statement.get(...params);
      } finally {
        await db.client.releaseConnection(connection);
      }
    },
  };
}
