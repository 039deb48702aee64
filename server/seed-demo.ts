/** Wires the demo seed in db/seeds to the server's repositories and password hashing. */
import { seed, type SeedResult } from '../db/seeds/demo-accounts.seed';
import { hashPassword } from './auth/password';
import type { Database } from './db/database';
import { loadDemoPlan } from './plans/demo-plan';
import { plansRepo } from './plans/plans.repo';
import { seedTraining } from './training/training.seed';
import { usersRepo } from './users/users.repo';

export function seedDemo(db: Database): Promise<SeedResult> {
  const users = usersRepo(db);
  const plans = plansRepo(db);
  return seed({
    createUser: (input) => users.create(input),
    createPlan: (ownerId, plan) => plans.create(ownerId, plan),
    hashPassword,
    loadDemoPlan,
    seedTraining: () => seedTraining(db),
  });
}
