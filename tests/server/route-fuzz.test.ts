/**
 * Generated bodies on every route that reads one: whatever a client sends, the answer is never a 5xx, and every
 * refusal comes in the error shape. ASVS 4.0.3 V5.1.3–V5.1.4 (input validated against a schema; structured data
 * checked for type, length and pattern) and V7.4.1 (a generic error reply, no stack), from memory.
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { minimalPlan, serverForFile, signedInAgent } from './server.harness';

const server = serverForFile({ PLAN_WRITES_PER_MINUTE: '100000', RATE_LIMIT_MAX: '100000' });
type Agent = Awaited<ReturnType<typeof signedInAgent>>['agent'];
let instructor: Agent;
let planId = '';
let classId = '';

beforeAll(async () => {
  instructor = (await signedInAgent(server, 'instructor')).agent;
  const plan = await instructor.post('/api/plans').send({ document: minimalPlan('Fuzzed bench') });
  expect(plan.status).toBe(201);
  planId = plan.body.id;
  const made = await instructor.post('/api/training/classes').send({ name: 'Fuzzed class' });
  expect(made.status).toBe(201);
  classId = made.body.id;
});

/** Bodies of any JSON shape, and objects carrying the field names these routes read, with values of any type. */
const body = fc.oneof(
  fc.jsonValue(),
  fc.record(
    {
      document: fc.jsonValue(),
      name: fc.jsonValue(),
      kind: fc.oneof(fc.constantFrom('puzzle', 'demonstration', 'lift', 'set'), fc.string()),
      itemId: fc.jsonValue(),
      dueAt: fc.oneof(fc.string(), fc.constant(null), fc.integer()),
      emails: fc.oneof(fc.array(fc.string()), fc.string()),
      action: fc.jsonValue(),
      plan: fc.jsonValue(),
      faults: fc.jsonValue(),
      steps: fc.jsonValue(),
      password: fc.jsonValue(),
      token: fc.jsonValue(),
    },
    { requiredKeys: [] },
  ),
);

const routes = (): [method: 'post' | 'put' | 'patch', path: string][] => [
  ['post', '/api/plans'],
  ['put', `/api/plans/${planId}`],
  ['patch', `/api/plans/${planId}`],
  ['post', `/api/plans/${planId}/duplicate`],
  ['post', '/api/plans/import'],
  ['post', `/api/plans/${planId}/shares`],
  ['post', `/api/plans/${planId}/work-record/as-found`],
  ['put', `/api/plans/${planId}/work-record/entries/step:set-1:1`],
  ['post', '/api/training/classes'],
  ['post', `/api/training/classes/${classId}/assignments`],
  ['post', `/api/training/classes/${classId}/invitations`],
  ['post', '/api/training/puzzles'],
  ['post', '/api/training/puzzles/check'],
  ['post', '/api/training/puzzles/from-library'],
  ['post', '/api/training/demonstrations'],
  ['put', '/api/training/demonstrations/no-such-id'],
  ['post', '/api/training/assignments/no-such-id/run'],
  ['post', '/api/training/runs/no-such-id/actions'],
  ['post', '/api/training/runs/no-such-id/submit'],
  ['patch', '/api/account'],
  ['post', '/api/account/password'],
  ['post', '/api/account/totp/confirm'],
  ['post', '/api/auth/forgot-password'],
  ['post', '/api/auth/reset-password'],
  ['post', '/api/auth/verify-email'],
];

describe('generated bodies on every route that reads one (ASVS 4.0.3 V5.1.3, V5.1.4, V7.4.1)', () => {
  it('answers each with a status below 500, and every refusal in the error shape', async () => {
    for (const [method, path] of routes()) {
      await fc.assert(
        fc.asyncProperty(body, async (sent) => {
          const res = await instructor[method](path).set('Content-Type', 'application/json').send(JSON.stringify(sent));
          expect(res.status, `${method.toUpperCase()} ${path} ${JSON.stringify(sent).slice(0, 120)}`).toBeLessThan(500);
          if (res.status >= 400) expect(ErrorBodySchema.safeParse(res.body).success, `${method} ${path}`).toBe(true);
        }),
        { numRuns: 25 },
      );
    }
  });
});
