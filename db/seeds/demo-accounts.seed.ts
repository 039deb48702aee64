/**
 * Demo data for a fresh database: one account per role, all with the same published demo password,
 * each holding a copy of the invented demo installation. Runs only when the users table is empty.
 */
import type { Knex } from 'knex';
import type { Role } from '../../shared/schemas/auth.schema';
import { hashPassword } from '../../server/auth/password';
import { loadDemoPlan } from '../../server/plans/demo-plan';
import { plansRepo } from '../../server/plans/plans.repo';
import { usersRepo } from '../../server/users/users.repo';
import { seedTraining } from './training.seed';

export const DEMO_PASSWORD = 'bench-demo-2026';

export const DEMO_ACCOUNTS: readonly { email: string; displayName: string; role: Role }[] = [
  { email: 'restorer@leadbench.test', displayName: 'Wren Calloway', role: 'restorer' },
  { email: 'instructor@leadbench.test', displayName: 'Odile Marchetti', role: 'instructor' },
  { email: 'trainee@leadbench.test', displayName: 'Tobin Ashgrove', role: 'trainee' },
  { email: 'admin@leadbench.test', displayName: 'Priya Halvorsen', role: 'admin' },
];

export interface SeedResult {
  accounts: number;
  /** Why the demo plan was left out, when it was. */
  planSkipped?: string;
}

export async function seed(knex: Knex): Promise<SeedResult> {
  const users = usersRepo(knex);
  const plans = plansRepo(knex);
  let plan: ReturnType<typeof loadDemoPlan> | undefined;
  let planSkipped: string | undefined;
  try {
    plan = loadDemoPlan();
  } catch (err) {
    planSkipped = err instanceof Error ? err.message : String(err);
  }
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  let accounts = 0;
  for (const account of DEMO_ACCOUNTS) {
    const user = await users.create({ ...account, passwordHash });
    if (!user) continue;
    accounts += 1;
    if (plan) await plans.create(user.id, plan);
  }
  if (accounts) await seedTraining(knex);
  return { accounts, ...(planSkipped ? { planSkipped } : {}) };
}
