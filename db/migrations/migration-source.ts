/**
 * Lists the migrations by import instead of scanning the folder, so they load the same way under
 * tsx, vitest and a bundled build. Add each new migration here, in order.
 */
import type { Knex } from 'knex';
import * as initial from './20261202_0001_initial';
import * as training from './20261202_0004_training';

const MIGRATIONS: Record<string, Knex.Migration> = {
  '20261202_0001_initial': initial,
  '20261202_0004_training': training,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(MIGRATIONS),
  getMigrationName: (name) => name,
  getMigration: async (name) => MIGRATIONS[name],
};
