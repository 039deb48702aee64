/** Opens the SQLite database through Knex and brings its schema up to date. */
import knexFactory, { type Knex } from 'knex';
import { ensureDatabaseFolder, knexConfig } from '../../db/knexfile';

export type Database = Knex;

export function openDatabase(filename: string): Database {
  ensureDatabaseFolder(filename);
  return knexFactory(knexConfig(filename));
}

/** Runs pending migrations; returns the names of the ones applied. */
export async function migrateLatest(db: Database): Promise<string[]> {
  const [, applied] = (await db.migrate.latest()) as [number, string[]];
  return applied;
}

export async function isDatabaseEmpty(db: Database): Promise<boolean> {
  const row = await db('users').count<{ n: number }[]>({ n: '*' }).first();
  return Number(row?.n ?? 0) === 0;
}
