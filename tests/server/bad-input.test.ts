/**
 * Hostile and generated plan bodies: every one gets a 4xx in the error shape, a bounded reply,
 * and never a 5xx. ASVS 4.0.3 V5.1.4 (structured data checked against a schema with limits) and
 * V13.2.2 / V11.1.4 (request sizes and business limits against resource exhaustion), from memory.
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { MAX_PROBLEMS_LISTED } from '../../server/http/validate';
import { minimalPlan, planWithSets, serverForFile, signedInAgent, startTestServer } from './server.harness';

const server = serverForFile({ PLAN_WRITES_PER_MINUTE: '100000' });
let owner: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  owner = await signedInAgent(server);
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;
const post = (body: string) =>
  owner.agent.post('/api/plans').set('Content-Type', 'application/json').send(body);

describe('unbounded arrays (ASVS 4.0.3 V5.1.4, V11.1.4)', () => {
  it('refuses 320,000 bad ringer lines with a short reply listing a fixed number of problems', async () => {
    const plan = planWithSets(1) as unknown as { sets: { ringerLines: unknown[] }[] };
    plan.sets[0].ringerLines = Array.from({ length: 320_000 }, () => -1);
    const body = JSON.stringify({ document: plan });
    expect(Buffer.byteLength(body)).toBeGreaterThan(900_000); // just under the 1 MB body limit

    const res = await post(body);

    expect(res.status).toBe(400);
    expect(res.text.length).toBeLessThan(20_000);
    const error = errorOf(res.body);
    expect(Object.keys(error.details ?? {}).length).toBeLessThanOrEqual(MAX_PROBLEMS_LISTED);
    expect(error.details?.['document.sets.0.ringerLines']).toBeDefined();
  });

  it.each([
    ['leadChanges', () => Array.from({ length: 5000 }, () => ({ kind: 'lift', pair: 99 }))],
    ['template', () => 'x'.repeat(50_000)],
    ['station', () => 'a'.repeat(50_000)],
  ])('bounds sets[].%s', async (field, value) => {
    const plan = planWithSets(1) as unknown as { sets: Record<string, unknown>[] };
    plan.sets[0][field] = value();
    const res = await post(JSON.stringify({ document: plan }));
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).details ?? {})).toEqual([`document.sets.0.${field}`]);
  });

  it('states the total count when more problems exist than are listed', async () => {
    const plan = planWithSets(200) as unknown as { sets: Record<string, unknown>[] };
    for (const set of plan.sets)
      Object.assign(set, { name: '', template: '', id: 'Bad Id', ringerLines: [0] });
    const res = await post(JSON.stringify({ document: plan }));
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(Object.keys(error.details ?? {})).toHaveLength(MAX_PROBLEMS_LISTED);
    expect(error.problemCount).toBe(800); // 4 broken fields × 200 sets, laid out above
    expect(error.message).toContain('800');
  });
});

describe('shapes that once reached a 5xx (ASVS 4.0.3 V7.4.1, V13.2.2)', () => {
  it('answers thousands of broken sets with 400, not a stack overflow', async () => {
    const sets = Array.from({ length: 30_000 }, () => ({ ringerLines: ['x', 'y', 'z'] }));
    const res = await post(JSON.stringify({ document: { ...minimalPlan(), sets } }));
    expect(res.status).toBe(400);
    expect(res.text.length).toBeLessThan(20_000);
  });

  it('answers a deeply nested body with 400', async () => {
    const depth = 200_000;
    const res = await post(`{"document":${'['.repeat(depth)}${']'.repeat(depth)}}`);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });

  it('stores adapters cabled in a circle without a server error', async () => {
    const plan = minimalPlan('Loop');
    for (const id of ['hub-a', 'hub-b'])
      plan.adapters.push({ id, name: id, template: 'bridging-adapter-4', position: { x: 0, y: 0 } });
    plan.cables.push(
      { id: 'c1', from: { part: 'hub-a', port: 'plug' }, to: { part: 'hub-b', port: 'jack-1' } },
      { id: 'c2', from: { part: 'hub-b', port: 'plug' }, to: { part: 'hub-a', port: 'jack-1' } },
    );
    const res = await post(JSON.stringify({ document: plan }));
    expect([201, 400]).toContain(res.status);
  });

  it('answers generated junk documents with 4xx in the error shape', async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue({ maxDepth: 6 }), async (document) => {
        const res = await post(JSON.stringify({ document }));
        expect(res.status).toBe(400);
        expect(ErrorBodySchema.safeParse(res.body).success).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it('answers generated mutations of a valid plan with 201 or 400, never 5xx', async () => {
    const base = planWithSets(2);
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom('name', 'ksu', 'sets', 'cables', 'adapters', 'required', 'version'),
        fc.anything({ maxDepth: 4 }),
        async (key, value) => {
          const res = await post(JSON.stringify({ document: { ...base, [key]: value } }));
          expect([201, 400]).toContain(res.status);
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe('plan write rate (ASVS 4.0.3 V11.1.4)', () => {
  it('limits plan writes per account with 429', async () => {
    const limited = await startTestServer({ PLAN_WRITES_PER_MINUTE: '3' });
    try {
      const { agent } = await signedInAgent(limited);
      const other = await signedInAgent(limited);
      for (let i = 0; i < 3; i++)
        expect((await agent.post('/api/plans').send({ document: minimalPlan() })).status).toBe(201);
      const res = await agent.post('/api/plans').send({ document: minimalPlan() });
      expect(res.status).toBe(429); // RFC 6585 §4
      expect(errorOf(res.body).code).toBe('RATE_LIMITED');
      expect((await agent.get('/api/plans')).status).toBe(200); // reads are not writes
      expect((await other.agent.post('/api/plans').send({ document: minimalPlan() })).status).toBe(201);
    } finally {
      await limited.close();
    }
  });
});
