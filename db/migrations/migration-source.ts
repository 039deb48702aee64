/**
 * Lists the migrations by import instead of scanning the folder, so they load the same way under
 * tsx, vitest and a bundled build. Add each new migration here, in order.
 */
import type { Knex } from 'knex';
import * as initial from './20261202_0001_initial';
import * as accounts from './20261202_0002_accounts';
import * as plansLibrary from './20261202_0003_plans_library';
import * as training from './20261202_0004_training';
import * as workRecords from './20261202_0005_work_records';

const MIGRATIONS: Record<string, Knex.Migration> = {
  '20261202_0001_initial': initial,
  '20261202_0002_accounts': accounts,
  '20261202_0003_plans_library': plansLibrary,
  '20261202_0004_training': training,
  '20261202_0005_work_records': workRecords,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(MIGRATIONS),
  getMigrationName: (name) => name,
  getMigration: async (name) => MIGRATIONS[name],
};
