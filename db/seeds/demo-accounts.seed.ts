/**
 * Demo data for a fresh database: one account per role, all with the same published demo password,
 * each holding a copy of the invented demo installation. Runs only when the users table is empty.
 *
 * The seed is handed the server's own account and plan functions (see `server/seed-demo.ts`), so demo
 * data goes through the same code as real data while db/ imports nothing from server/.
 */
import type { Plan } from '../../shared/engine/index';
import type { Role } from '../../shared/schemas/auth.schema';

export const DEMO_PASSWORD = 'bench-demo-2026';

export const DEMO_ACCOUNTS: readonly { email: string; displayName: string; role: Role }[] = [
  { email: 'restorer@leadbench.test', displayName: 'Wren Calloway', role: 'restorer' },
  { email: 'instructor@leadbench.test', displayName: 'Odile Marchetti', role: 'instructor' },
  { email: 'trainee@leadbench.test', displayName: 'Tobin Ashgrove', role: 'trainee' },
  { email: 'admin@leadbench.test', displayName: 'Priya Halvorsen', role: 'admin' },
];

export interface SeedDeps {
  /** Returns null when the e-mail is taken. */
  createUser(input: {
    email: string;
    displayName: string;
    role: Role;
    passwordHash: string;
  }): Promise<{ id: string } | null>;
  createPlan(ownerId: string, plan: Plan): Promise<unknown>;
  hashPassword(password: string): Promise<string>;
  /** Throws with a readable message when the demo plan cannot be read. */
  loadDemoPlan(): Plan;
  /** Adds the demo class, puzzles and demonstration once the demo accounts exist. */
  seedTraining(): Promise<void>;
}

export interface SeedResult {
  accounts: number;
  /** Why the demo plan was left out, when it was. */
  planSkipped?: string;
}

export async function seed(deps: SeedDeps): Promise<SeedResult> {
  let plan: Plan | undefined;
  let planSkipped: string | undefined;
  try {
    plan = deps.loadDemoPlan();
  } catch (err) {
    planSkipped = err instanceof Error ? err.message : String(err);
  }
  let accounts = 0;
  for (const account of DEMO_ACCOUNTS) {
    // One hash per account: each gets its own salt, so equal passwords never share a stored hash.
    const user = await deps.createUser({ ...account, passwordHash: await deps.hashPassword(DEMO_PASSWORD) });
    if (!user) continue;
    accounts += 1;
    if (plan) await deps.createPlan(user.id, plan);
  }
  if (accounts) await deps.seedTraining();
  return { accounts, ...(planSkipped ? { planSkipped } : {}) };
}
