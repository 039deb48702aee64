/** Every change is a revision: list, open, compare, restore. Plus export and import of plan files. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import {
  PlanCompareSchema,
  PlanRevisionListSchema,
  PlanRevisionSchema,
} from '../../shared/schemas/plan-revisions.schema';
import { PlanRecordSchema } from '../../shared/schemas/plans.schema';
import { minimalPlan, planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';
import { createPlan, type Agent } from './plans-fixtures';

let server: TestServer;
let owner: Agent;

beforeAll(async () => {
  server = await startTestServer({ PLAN_IMPORT_MAX_BYTES: '20000' });
  owner = (await signedInAgent(server)).agent;
});
afterAll(async () => {
  await server.close();
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;

describe('revisions', () => {
  it('records each change with who and when, opens one, compares two and restores one as a new revision', async () => {
    const plan = await createPlan(owner, planWithSets(1, 'Chemist'));
    const wired = planWithSets(2, 'Chemist');
    wired.sets[0].leadChanges = [{ kind: 'lift', pair: 1, conductor: 'both' }];
    const saved = PlanRecordSchema.parse(
      (await owner.put(`/api/plans/${plan.id}`).send({ document: wired, baseUpdatedAt: plan.updatedAt }))
        .body,
    );
    // Saving the same document again is not a change.
    const same = PlanRecordSchema.parse(
      (await owner.put(`/api/plans/${plan.id}`).send({ document: wired, baseUpdatedAt: saved.updatedAt }))
        .body,
    );
    expect(same.revision).toBe(2);
    expect(same.updatedAt).toBe(saved.updatedAt);

    const revisions = PlanRevisionListSchema.parse((await owner.get(`/api/plans/${plan.id}/revisions`)).body);
    expect(revisions.items.map((r) => [r.number, r.reason, r.setCount])).toEqual([
      [2, 'save', 2],
      [1, 'create', 1],
    ]);
    expect(revisions.items[0]?.authorName).toBe('Test restorer');

    const first = PlanRevisionSchema.parse((await owner.get(`/api/plans/${plan.id}/revisions/1`)).body);
    expect(first.document.sets).toHaveLength(1);

    const compare = PlanCompareSchema.parse(
      (await owner.get(`/api/plans/${plan.id}/revisions/compare?from=1&to=2`)).body,
    );
    // Pair 1 is white-blue in the 25-pair colour code (ICEA S-80-576).
    expect(compare.changes.map((c) => c.text)).toEqual([
      'Desk 1: pair 1 (white-blue) lifted',
      'Added set Desk 2 (six-key)',
    ]);

    const restored = await owner
      .post(`/api/plans/${plan.id}/revisions/1/restore`)
      .send({ baseUpdatedAt: saved.updatedAt });
    expect(restored.status).toBe(200);
    const now = PlanRecordSchema.parse(restored.body);
    expect(now.revision).toBe(3);
    expect(now.document.sets).toEqual(first.document.sets);
    const after = PlanRevisionListSchema.parse((await owner.get(`/api/plans/${plan.id}/revisions`)).body);
    expect(after.items[0]).toMatchObject({ number: 3, reason: 'restore', restoredFrom: 1 });
  });

  it('answers 404 for a revision that does not exist and 400 for one that cannot', async () => {
    const plan = await createPlan(owner, minimalPlan('Ironmonger'));
    expect((await owner.get(`/api/plans/${plan.id}/revisions/9`)).status).toBe(404);
    expect((await owner.get(`/api/plans/${plan.id}/revisions/compare?from=1&to=9`)).status).toBe(404);
    const bad = await owner.get(`/api/plans/${plan.id}/revisions/zero`);
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).details?.rev).toEqual(['Use a revision number']);
    const stale = await owner
      .post(`/api/plans/${plan.id}/revisions/1/restore`)
      .send({ baseUpdatedAt: '2020-01-01T00:00:00.000Z' });
    expect(stale.status).toBe(409);
  });
});

describe('plan files', () => {
  it('exports the plan in the engine format and imports it back equal', async () => {
    const original = planWithSets(2, 'Tailor, upstairs');
    original.sets[1].leadChanges = [{ kind: 'move', pair: 2, toPair: 17 }];
    const plan = await createPlan(owner, original);
    const exported = await owner
      .get(`/api/plans/${plan.id}/export`)
      .buffer(true)
      .parse((res, cb) => {
        let text = '';
        res.on('data', (c: Buffer) => (text += c.toString()));
        res.on('end', () => cb(null, text));
      });
    expect(exported.status).toBe(200);
    expect(exported.headers['content-disposition']).toBe('attachment; filename=tailor-upstairs.json'); // RFC 6266 token form;
    const text = exported.body as string;
    expect(JSON.parse(text)).toEqual(plan.document); // the plan document itself (shared/engine/examples/README.md)

    const imported = await owner
      .post('/api/plans/import')
      .attach('file', Buffer.from(text), 'tailor-upstairs.json');
    expect(imported.status).toBe(201);
    const back = PlanRecordSchema.parse(imported.body);
    expect(back.id).not.toBe(plan.id);
    expect(back.document).toEqual(plan.document);
  });

  it('refuses a file with a bad cable reference, naming the place, and stores nothing', async () => {
    const before = await server.db('plans').count<{ n: number }[]>({ n: '*' }).first();
    const bad = planWithSets(1, 'Broken file');
    bad.cables.push({
      id: 'loose',
      from: { part: 'set-1', port: 'cord' },
      to: { part: 'ghost', port: 'jack-1' },
    });
    const res = await owner
      .post('/api/plans/import')
      .attach('file', Buffer.from(JSON.stringify(bad)), 'broken.json');
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    // message from shared/engine/document/validate-plan.ts, path in the engine's own form
    expect(error.message).toBe('The file was not imported. cables[0].to.part: No part "ghost" in the plan.');
    expect(error.details).toEqual({ 'cables[0].to.part': ['No part "ghost" in the plan'] });
    const after = await server.db('plans').count<{ n: number }[]>({ n: '*' }).first();
    expect(after?.n).toBe(before?.n);
  });

  it('refuses a file that is not JSON, a file over the limit, and a request without a file', async () => {
    const notJson = await owner
      .post('/api/plans/import')
      .attach('file', Buffer.from('{"version": 1,'), 'half.json');
    expect(notJson.status).toBe(400);
    expect(errorOf(notJson.body).code).toBe('BAD_JSON');
    expect(errorOf(notJson.body).message).toMatch(/^The file is not a plan file: it is not valid JSON/);

    const huge = Buffer.from(JSON.stringify({ ...minimalPlan('Huge'), description: 'x'.repeat(25_000) }));
    const tooBig = await owner.post('/api/plans/import').attach('file', huge, 'huge.json');
    expect(tooBig.status).toBe(413); // RFC 9110 §15.5.14 Content Too Large
    expect(errorOf(tooBig.body).message).toBe('A plan file may be at most 19 kB.'); // PLAN_IMPORT_MAX_BYTES 20000 above

    const none = await owner.post('/api/plans/import').field('note', 'no file');
    expect(none.status).toBe(400);
    expect(errorOf(none.body).details?.file).toEqual(['No file was sent']);
  });

  it('refuses a plan id that is not the caller’s', async () => {
    const stranger = (await signedInAgent(server)).agent;
    const plan = await createPlan(owner, minimalPlan('Locksmith'));
    expect((await stranger.get(`/api/plans/${plan.id}/export`)).status).toBe(404);
    expect((await stranger.get(`/api/plans/${plan.id}/revisions`)).status).toBe(404);
  });
});
