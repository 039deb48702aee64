/**
 * Knex settings for the one SQLite database. Used by the server at boot and by the migrate command.
 * WAL lets readers continue while a plan is saved; foreign keys make deleting a user remove their
 * sessions and plans.
 */
import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import type { Knex } from 'knex';
import { migrationSource } from './migrations/migration-source';

export function knexConfig(filename: string): Knex.Config {
  return {
    client: 'better-sqlite3',
    connection: { filename },
    useNullAsDefault: true,
    pool: {
      min: 1,
      max: 1,
      afterCreate: (
        conn: { pragma(sql: string): unknown },
        done: (err: Error | null, conn: unknown) => void,
      ) => {
        try {
          conn.pragma('journal_mode = WAL');
          conn.pragma('foreign_keys = ON');
          conn.pragma('busy_timeout = 5000');
          done(null, conn);
        } catch (err) {
          done(err as Error, conn);
        }
      },
    },
    migrations: { migrationSource, tableName: 'knex_migrations' },
  };
}

/** Makes sure the folder for the database file exists (data/ is not in git). */
export function ensureDatabaseFolder(filename: string): void {
  if (filename !== ':memory:') mkdirSync(dirname(filename), { recursive: true });
}

export default knexConfig(process.env.DATABASE_FILE ?? 'data/leadbench.sqlite');
