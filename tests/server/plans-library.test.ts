/** The plans list (search, sort, paging, scopes), quotas, copies, renaming, and delete with undo and purge. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { PlanListSchema, PlanRecordSchema } from '../../shared/schemas/plans.schema';
import { plansRepo } from '../../server/plans/plans.repo';
import { minimalPlan, planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';
import { createPlan, type Agent } from './plans-fixtures';

let server: TestServer;
let owner: Agent;

beforeAll(async () => {
  server = await startTestServer({ PLAN_QUOTA_COUNT: '8' });
  owner = (await signedInAgent(server)).agent;
  await server.db('plans').delete(); // the demo plan from sign-up, so counts start at 0
});
afterAll(async () => {
  await server.close();
});

const list = async (query: string) => {
  const res = await owner.get(`/api/plans${query}`);
  expect(res.status).toBe(200);
  return PlanListSchema.parse(res.body);
};

describe('the list', () => {
  it('searches, sorts and pages on the server', async () => {
    await createPlan(owner, planWithSets(3, 'Bakery front'));
    await createPlan(owner, planWithSets(1, 'Print shop'));
    await createPlan(owner, {
      ...planWithSets(5, 'Bakery back'),
      description: 'ovens and the 100% humid room',
    });

    const found = await list('?q=bakery&sort=setCount&order=asc');
    expect(found.items.map((p) => [p.name, p.setCount])).toEqual([
      ['Bakery front', 3],
      ['Bakery back', 5],
    ]);
    expect(found.total).toBe(2);
    // "%" is matched as a character, not a wildcard
    expect((await list('?q=100%25')).items.map((p) => p.name)).toEqual(['Bakery back']);

    const page2 = await list('?sort=name&order=asc&pageSize=2&page=2');
    expect(page2).toMatchObject({ page: 2, pageSize: 2, total: 3 });
    expect(page2.items.map((p) => p.name)).toEqual(['Print shop']);
    expect(page2.usage).toMatchObject({ plans: 3, maxPlans: 8, maxSets: 60 });
  });

  it('refuses bad list parameters with their names', async () => {
    const res = await owner.get('/api/plans?page=0&pageSize=500&sort=colour');
    expect(res.status).toBe(400);
    expect(Object.keys(ErrorBodySchema.parse(res.body).error.details ?? {}).sort()).toEqual([
      'page',
      'pageSize',
      'sort',
    ]);
  });

  it('counts open faults with the engine and sorts by them', async () => {
    // The demo installation is invented to show joined lines (shared/engine/examples/README.md).
    const { loadDemoPlan } = await import('../../server/plans/demo-plan');
    const demo = await createPlan(owner, loadDemoPlan());
    const clean = await createPlan(owner, minimalPlan('Empty KSU'));
    expect(demo.faultCount).toBeGreaterThan(0);
    expect(clean.faultCount).toBe(0); // no sets: nothing can be joined
    const sorted = await list('?sort=faultCount&order=desc&pageSize=1');
    expect(sorted.items[0]?.id).toBe(demo.id);
  });
});

describe('quotas', () => {
  it('refuses a plan past the account limit and lets it in once there is room', async () => {
    const before = await list('');
    for (let i = before.usage.plans; i < 8; i++) await createPlan(owner, minimalPlan(`Filler ${i}`));
    const over = await owner.post('/api/plans').send({ document: minimalPlan('One too many') });
    expect(over.status).toBe(409);
    expect(ErrorBodySchema.parse(over.body).error.message).toBe(
      'Your account holds at most 8 plans. Delete one you no longer need first.', // our own wording
    );
    const victim = (await list('?q=Filler&pageSize=1')).items[0]!;
    expect((await owner.delete(`/api/plans/${victim.id}`)).status).toBe(204);
    expect((await owner.post('/api/plans').send({ document: minimalPlan('Now it fits') })).status).toBe(201);
    // Undoing the delete would go past the limit again.
    expect((await owner.post(`/api/plans/${victim.id}/undelete`)).status).toBe(409);
  });

  it('counts bytes too', async () => {
    const small = await startTestServer({ PLAN_QUOTA_BYTES: '2000' });
    try {
      const agent = (await signedInAgent(small)).agent;
      await small.db('plans').delete();
      expect((await agent.post('/api/plans').send({ document: minimalPlan('Fits') })).status).toBe(201);
      const big = { ...minimalPlan('Too long'), description: 'x'.repeat(1900) };
      const res = await agent.post('/api/plans').send({ document: big });
      expect(res.status).toBe(409);
      expect(ErrorBodySchema.parse(res.body).error.message).toMatch(
        /more than the 0 MB your account may keep/,
      );
    } finally {
      await small.close();
    }
  });
});

describe('rename, copy, delete and undo', () => {
  it('renames by name alone, guarded by the time last seen', async () => {
    await server.db('plans').delete();
    const plan = await createPlan(owner, planWithSets(2, 'Dairy'));
    const res = await owner
      .patch(`/api/plans/${plan.id}`)
      .send({ name: 'Dairy, cold room', baseUpdatedAt: plan.updatedAt });
    expect(res.status).toBe(200);
    const renamed = PlanRecordSchema.parse(res.body);
    expect(renamed.document.name).toBe('Dairy, cold room');
    expect(renamed.document.sets).toEqual(plan.document.sets);
    const stale = await owner
      .patch(`/api/plans/${plan.id}`)
      .send({ name: 'Again', baseUpdatedAt: plan.updatedAt });
    expect(stale.status).toBe(409);
    const blank = await owner
      .patch(`/api/plans/${plan.id}`)
      .send({ name: ' ', baseUpdatedAt: renamed.updatedAt });
    expect(ErrorBodySchema.parse(blank.body).error.details?.name).toEqual(['A name is required']);
  });

  it('duplicates into a new plan with its own history', async () => {
    const plan = await createPlan(owner, planWithSets(2, 'Garage'));
    const res = await owner.post(`/api/plans/${plan.id}/duplicate`).send({});
    expect(res.status).toBe(201);
    const copy = PlanRecordSchema.parse(res.body);
    expect(copy.id).not.toBe(plan.id);
    expect(copy.name).toBe('Copy of Garage');
    expect(copy.document.sets).toEqual(plan.document.sets);
    expect(copy.revision).toBe(1);
    const named = await owner.post(`/api/plans/${plan.id}/duplicate`).send({ name: 'Garage, second bay' });
    expect(PlanRecordSchema.parse(named.body).name).toBe('Garage, second bay');
    expect((await owner.post('/api/plans/no-such-plan/duplicate').send({})).status).toBe(404);
  });

  it('keeps a deleted plan in the recently deleted list, brings it back, and purges it after 30 days', async () => {
    const plan = await createPlan(owner, planWithSets(1, 'Florist'));
    expect((await owner.delete(`/api/plans/${plan.id}`)).status).toBe(204);
    expect((await list('')).items.map((p) => p.id)).not.toContain(plan.id);
    const bin = await list('?scope=deleted');
    expect(bin.items.map((p) => p.id)).toEqual([plan.id]);
    expect(bin.items[0]?.deletedAt).not.toBeNull();

    const back = await owner.post(`/api/plans/${plan.id}/undelete`);
    expect(back.status).toBe(200);
    expect(PlanRecordSchema.parse(back.body).deletedAt).toBeNull();
    expect((await owner.post(`/api/plans/${plan.id}/undelete`)).status).toBe(404);

    await owner.delete(`/api/plans/${plan.id}`);
    // 31 days ago: past the 30 days a deleted plan is kept (server/plans/plans.service.ts).
    await server
      .db('plans')
      .where({ id: plan.id })
      .update({ deleted_at: new Date(Date.now() - 31 * 864e5).toISOString() });
    await list('?scope=deleted'); // listing purges what is due
    expect(await server.db('plans').where({ id: plan.id }).first()).toBeUndefined();
    expect(await server.db('plan_revisions').where({ plan_id: plan.id }).first()).toBeUndefined();
    expect(await plansRepo(server.db).findDeleted(plan.id, (await server.db('users').first()).id)).toBeNull();
  });
});
