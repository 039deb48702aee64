import request from 'supertest';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { SessionInfoSchema } from '../../shared/schemas/auth.schema';
import { PlanListSchema } from '../../shared/schemas/plans.schema';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../db/seeds/demo-accounts.seed';
import { seedDemo } from '../../server/seed-demo';
import { isDatabaseEmpty } from '../../server/db/database';
import { startTestServer, type TestServer } from './server.harness';
import { sweep } from '../../shared/engine/index';
import { loadDemoPlan } from '../../server/plans/demo-plan';
import { DEMO_HEALTHY_PLAN_NAME, healthyDemoPlan } from '../../server/training/training.seed';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

it('creates one demo account per role that signs in with the demo password', async () => {
  expect(await isDatabaseEmpty(server.db)).toBe(true);

  const result = await seedDemo(server.db);

  expect(result.accounts).toBe(4); // one per role: restorer, instructor, trainee, admin (product rule)
  expect(await isDatabaseEmpty(server.db)).toBe(false);
  for (const account of DEMO_ACCOUNTS) {
    const res = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: account.email, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    expect(SessionInfoSchema.parse(res.body).user?.role).toBe(account.role);
  }
  expect(new Set(DEMO_ACCOUNTS.map((a) => a.role))).toEqual(
    new Set(['restorer', 'instructor', 'trainee', 'admin']),
  );
});

it('does not duplicate accounts when run again', async () => {
  const again = await seedDemo(server.db);
  expect(again.accounts).toBe(0);
  expect(await server.db('users').count({ n: '*' }).first()).toEqual({ n: 4 });
});

it('gives every demo account the demo plan, and the instructor a healthy copy for puzzles', async () => {
  for (const account of DEMO_ACCOUNTS) {
    const agent = request.agent(server.app);
    await agent.post('/api/auth/sign-in').send({ email: account.email, password: DEMO_PASSWORD });
    const names = PlanListSchema.parse((await agent.get('/api/plans')).body)
      .items.map((p) => p.name)
      .sort();
    const demo = loadDemoPlan().name;
    expect(names).toEqual(account.role === 'instructor' ? [DEMO_HEALTHY_PLAN_NAME, demo].sort() : [demo]);
  }
});

it("makes the instructor's healthy copy the demo plan with its cure, which no state shows a finding in", () => {
  const demo = loadDemoPlan();
  const healthy = healthyDemoPlan(demo)!;
  expect(healthy.sets.map((s) => s.id)).toEqual(demo.sets.map((s) => s.id));
  expect(healthy.sets.some((s) => s.leadChanges.length > 0)).toBe(true);
  const swept = sweep(healthy);
  expect(swept.complete).toBe(true);
  expect(swept.findings.map((f) => f.finding.message)).toEqual([]);
});
