import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { PlanListSchema, PlanRecordSchema } from '../../shared/schemas/plans.schema';
import { minimalPlan, planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';

let server: TestServer;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let stranger: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  server = await startTestServer();
  owner = await signedInAgent(server);
  stranger = await signedInAgent(server);
  // Start each account from an empty list, whether or not the demo plan was added at sign-up.
  await server.db('plans').delete();
});
afterAll(async () => {
  await server.close();
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;

describe('plans CRUD', () => {
  it('needs a session', async () => {
    const res = await request(server.app).get('/api/plans');
    expect(res.status).toBe(401);
    expect(errorOf(res.body).code).toBe('UNAUTHENTICATED');
  });

  it('creates, reads, lists, updates and deletes a plan', async () => {
    // Create
    const created = await owner.agent.post('/api/plans').send({ document: planWithSets(3, 'Parts counter') });
    expect(created.status).toBe(201);
    const plan = PlanRecordSchema.parse(created.body);
    expect(plan).toMatchObject({
      name: 'Parts counter',
      description: 'Two lines on the bench KSU',
      setCount: 3,
    }); // derived from the document
    expect(created.headers.location).toBe(`/api/plans/${plan.id}`);

    // Read
    const read = await owner.agent.get(`/api/plans/${plan.id}`);
    expect(PlanRecordSchema.parse(read.body).document.sets.map((s) => s.id)).toEqual([
      'set-1',
      'set-2',
      'set-3',
    ]);

    // List
    const list = PlanListSchema.parse((await owner.agent.get('/api/plans')).body);
    expect(list.items.map((p) => p.id)).toContain(plan.id);
    expect(list).toMatchObject({ page: 1, pageSize: 20, total: 1 });
    expect(list.items[0]).not.toHaveProperty('document');

    // Update
    const updated = await owner.agent
      .put(`/api/plans/${plan.id}`)
      .send({ document: planWithSets(5, 'Parts counter, rewired'), baseUpdatedAt: plan.updatedAt });
    expect(updated.status).toBe(200);
    const after = PlanRecordSchema.parse(updated.body);
    expect(after).toMatchObject({ name: 'Parts counter, rewired', setCount: 5, createdAt: plan.createdAt });
    expect(after.updatedAt > plan.updatedAt).toBe(true); // ISO 8601 UTC strings sort in time order

    // Delete: gone from the plan routes, kept in the recently deleted list until undone or purged
    expect((await owner.agent.delete(`/api/plans/${plan.id}`)).status).toBe(204);
    expect((await owner.agent.get(`/api/plans/${plan.id}`)).status).toBe(404);
    expect((await owner.agent.delete(`/api/plans/${plan.id}`)).status).toBe(404);
  });

  it('accepts a plan at the set bound, above the 100 kB default body limit, and refuses one set more', async () => {
    // 60 sets (PLAN_MAX_SETS default, server/config.ts) fed through two levels of four-jack bridging adapters.
    const big = planWithSets(60, 'Large floor');
    big.description = 'Every desk of the trading floor, cabled through bridging adapters. '.repeat(25);
    big.ksu.ports = 4;
    let cable = 0;
    const plug = (part: string, to: { part: string; port: string }) =>
      big.cables.push({
        id: `cable-${++cable}`,
        from: { part, port: part.startsWith('set') ? 'cord' : 'plug' },
        to,
        label: `Run ${cable} along the skirting board`,
      });
    for (let a = 1; a <= 4; a++) {
      big.adapters.push({
        id: `hub-${a}`,
        name: `Riser hub ${a}`,
        template: 'bridging-adapter-4',
        position: { x: a * 100, y: 50 },
      });
      plug(`hub-${a}`, { part: 'ksu', port: `port-${a}` });
    }
    for (let a = 1; a <= 15; a++) {
      big.adapters.push({
        id: `desk-hub-${a}`,
        name: `Desk hub ${a}`,
        template: 'bridging-adapter-4',
        position: { x: a * 40, y: 120 },
      });
      plug(`desk-hub-${a}`, { part: `hub-${Math.ceil(a / 4)}`, port: `jack-${((a - 1) % 4) + 1}` });
    }
    for (let s = 1; s <= 60; s++) {
      plug(`set-${s}`, { part: `desk-hub-${Math.ceil(s / 4)}`, port: `jack-${((s - 1) % 4) + 1}` });
    }
    // Saved as a person would keep it in a file: pretty-printed, with generous indentation.
    const text = JSON.stringify({ document: big }, null, 10);
    expect(Buffer.byteLength(text)).toBeGreaterThan(100 * 1024); // express.json() default limit is 100 kB (body-parser docs)

    const res = await owner.agent.post('/api/plans').set('Content-Type', 'application/json').send(text);

    expect(res.status).toBe(201);
    const saved = PlanRecordSchema.parse(res.body);
    expect(saved.setCount).toBe(60);
    expect(saved.document.cables).toHaveLength(79); // 4 + 15 + 60 cables laid above

    const tooBig = planWithSets(61, 'One desk too many');
    const refused = await owner.agent.post('/api/plans').send({ document: tooBig });
    expect(refused.status).toBe(400);
    expect(errorOf(refused.body).details?.['document.sets']).toEqual([
      'A plan may hold at most 60 sets; this one has 61', // our own wording, server/plans/plan-document.ts
    ]);
  });

  it('refuses parts that do not fit together, naming the path', async () => {
    const bad = planWithSets(1);
    bad.sets[0].template = 'no-such-set';
    bad.cables.push({
      id: 'loose',
      from: { part: 'set-1', port: 'cord' },
      to: { part: 'ghost', port: 'jack-1' },
    });
    const res = await owner.agent.post('/api/plans').send({ document: bad });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.message).toBe('The plan has problems that must be fixed before saving.'); // our own wording
    // messages from shared/engine/document/validate-plan.ts
    expect(error.details?.['document.sets.0.template']).toEqual(['Unknown key set template "no-such-set"']);
    expect(error.details?.['document.cables.0.to.part']).toEqual(['No part "ghost" in the plan']);
  });

  it('refuses an invalid document with field paths', async () => {
    const bad = minimalPlan();
    (bad.ksu as { lines: unknown[] }).lines = [];
    (bad as { name: string }).name = '';
    const res = await owner.agent.post('/api/plans').send({ document: bad });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe('VALIDATION_FAILED');
    // messages from shared/engine/document/plan.schema.ts
    expect(error.details?.['document.ksu.lines']).toEqual(['A KSU needs at least one line']);
    expect(error.details?.['document.name']).toEqual(['A name is required']);
  });

  it('refuses a body without a document', async () => {
    const res = await owner.agent.post('/api/plans').send({ name: 'no document' });
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).details ?? {})).toEqual(['document']);
  });
});

describe('owner isolation', () => {
  it("answers 404 for another user's plan on every route", async () => {
    const plan = PlanRecordSchema.parse(
      (await owner.agent.post('/api/plans').send({ document: minimalPlan('Mine') })).body,
    );
    const get = await stranger.agent.get(`/api/plans/${plan.id}`);
    const put = await stranger.agent
      .put(`/api/plans/${plan.id}`)
      .send({ document: minimalPlan('Stolen'), baseUpdatedAt: plan.updatedAt });
    const del = await stranger.agent.delete(`/api/plans/${plan.id}`);
    for (const res of [get, put, del]) {
      expect(res.status).toBe(404); // not 403: another user's plan is not revealed to exist
      expect(errorOf(res.body)).toEqual({ code: 'NOT_FOUND', message: 'That plan was not found.' });
    }
    const list = PlanListSchema.parse((await stranger.agent.get('/api/plans')).body);
    expect(list.items.map((p) => p.id)).not.toContain(plan.id);
    const stillMine = PlanRecordSchema.parse((await owner.agent.get(`/api/plans/${plan.id}`)).body);
    expect(stillMine.name).toBe('Mine');
  });
});

describe('concurrent edits', () => {
  it('answers 409 CONFLICT when the plan changed since it was loaded', async () => {
    const plan = PlanRecordSchema.parse(
      (await owner.agent.post('/api/plans').send({ document: minimalPlan('Shared') })).body,
    );
    const firstTab = await owner.agent
      .put(`/api/plans/${plan.id}`)
      .send({ document: minimalPlan('Shared, first tab'), baseUpdatedAt: plan.updatedAt });
    expect(firstTab.status).toBe(200);

    const secondTab = await owner.agent
      .put(`/api/plans/${plan.id}`)
      .send({ document: minimalPlan('Shared, second tab'), baseUpdatedAt: plan.updatedAt });

    expect(secondTab.status).toBe(409); // RFC 9110 §15.5.10
    expect(errorOf(secondTab.body)).toEqual({
      code: 'CONFLICT',
      message: 'This plan was saved elsewhere since you opened it. Reload it first.', // our own wording
    });
    const stored = PlanRecordSchema.parse((await owner.agent.get(`/api/plans/${plan.id}`)).body);
    expect(stored.name).toBe('Shared, first tab');
  });

  it('refuses a save that does not say which copy it replaces', async () => {
    const plan = PlanRecordSchema.parse(
      (await owner.agent.post('/api/plans').send({ document: minimalPlan('Unguarded') })).body,
    );
    const res = await owner.agent.put(`/api/plans/${plan.id}`).send({ document: minimalPlan('Blind write') });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).details?.baseUpdatedAt).toEqual(['Send the time you last loaded the plan']);
    const stored = PlanRecordSchema.parse((await owner.agent.get(`/api/plans/${plan.id}`)).body);
    expect(stored.name).toBe('Unguarded');
  });

  it('gives back-to-back saves distinct timestamps', async () => {
    const plan = PlanRecordSchema.parse(
      (await owner.agent.post('/api/plans').send({ document: minimalPlan('Quick') })).body,
    );
    let base = plan.updatedAt;
    for (let i = 0; i < 3; i++) {
      const res = await owner.agent
        .put(`/api/plans/${plan.id}`)
        .send({ document: minimalPlan(`Quick ${i}`), baseUpdatedAt: base });
      expect(res.status).toBe(200);
      const next = PlanRecordSchema.parse(res.body).updatedAt;
      expect(next).not.toBe(base);
      base = next;
    }
  });
});
