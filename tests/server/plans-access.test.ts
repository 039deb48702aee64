/**
 * Who may do what with a plan, route by route, for every kind of caller. Our own access design
 * (server/plans/plans.service.ts): the owner does everything; a person it is shared with (by e-mail or link) may
 * read, export, copy, see photos and read the work record and its PDF; everyone else signed in gets 404 as if the plan did not exist (admins too:
 * plan contents are private); nobody signed out gets past 401. An instructor sees a trainee's plan once shared.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { PlanShareListSchema, ShareCreatedSchema } from '../../shared/schemas/plan-shares.schema';
import { PlanPhotoSchema } from '../../shared/schemas/plan-photos.schema';
import type { PlanRecord } from '../../shared/schemas/plans.schema';
import { minimalPlan, planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';
import { createPlan, photoPng, type Agent } from './plans-fixtures';

type Actor = 'anonymous' | 'owner' | 'restorer' | 'recipient' | 'instructor' | 'trainee' | 'admin';
const ACTORS: Actor[] = ['anonymous', 'owner', 'restorer', 'recipient', 'instructor', 'trainee', 'admin'];

let server: TestServer;
const agents = {} as Record<Actor, Agent>;
let plan: PlanRecord;
let photoId: string;
let shareId: string;

beforeAll(async () => {
  server = await startTestServer();
  agents.anonymous = request.agent(server.app);
  for (const [actor, role] of [
    ['owner', 'restorer'],
    ['restorer', 'restorer'],
    ['recipient', 'restorer'],
    ['instructor', 'instructor'],
    ['trainee', 'trainee'],
    ['admin', 'admin'],
  ] as const) {
    const signed = await signedInAgent(server, role);
    agents[actor] = signed.agent;
    if (actor === 'recipient') recipientEmail = signed.user.email;
  }
  plan = await createPlan(agents.owner, planWithSets(2, 'Matrix plan'));
  const shared = await agents.owner
    .post(`/api/plans/${plan.id}/shares`)
    .send({ kind: 'user', email: recipientEmail });
  shareId = ShareCreatedSchema.parse(shared.body).share.id;
  const photo = await agents.owner
    .post(`/api/plans/${plan.id}/photos`)
    .field('partId', 'set-1')
    .attach('file', await photoPng(), 'desk.png');
  photoId = PlanPhotoSchema.parse(photo.body).id;
});
let recipientEmail = '';
afterAll(async () => {
  await server.close();
});

/** Read routes: open to the owner and the recipient. Write routes: owner only (recipient 403). */
type Kind = 'read' | 'write';
interface Route {
  name: string;
  kind: Kind;
  send(agent: Agent): request.Test;
}

const p = () => `/api/plans/${plan.id}`;
const routes: Route[] = [
  { name: 'GET plan', kind: 'read', send: (a) => a.get(p()) },
  { name: 'GET revisions', kind: 'read', send: (a) => a.get(`${p()}/revisions`) },
  { name: 'GET one revision', kind: 'read', send: (a) => a.get(`${p()}/revisions/1`) },
  { name: 'GET compare', kind: 'read', send: (a) => a.get(`${p()}/revisions/compare?from=1&to=1`) },
  { name: 'GET export', kind: 'read', send: (a) => a.get(`${p()}/export`) },
  { name: 'GET photos', kind: 'read', send: (a) => a.get(`${p()}/photos`) },
  { name: 'GET photo image', kind: 'read', send: (a) => a.get(`${p()}/photos/${photoId}/image`) },
  { name: 'GET photo thumb', kind: 'read', send: (a) => a.get(`${p()}/photos/${photoId}/thumb`) },
  { name: 'POST duplicate', kind: 'read', send: (a) => a.post(`${p()}/duplicate`).send({}) },
  { name: 'GET work record', kind: 'read', send: (a) => a.get(`${p()}/work-record`) },
  { name: 'GET work sheet PDF', kind: 'read', send: (a) => a.get(`${p()}/work-sheet.pdf`) },
  { name: 'POST work record as found', kind: 'write', send: (a) => a.post(`${p()}/work-record/as-found`) },
  {
    name: 'PUT work record entry',
    kind: 'write',
    send: (a) => a.put(`${p()}/work-record/entries/step:set-1:1`).send({ done: true, initials: 'RB' }),
  },
  {
    name: 'PUT plan',
    kind: 'write',
    send: (a) => a.put(p()).send({ document: planWithSets(2, 'Matrix plan'), baseUpdatedAt: plan.updatedAt }),
  },
  {
    name: 'PATCH rename',
    kind: 'write',
    send: (a) => a.patch(p()).send({ name: 'Matrix plan', baseUpdatedAt: plan.updatedAt }),
  },
  {
    name: 'POST restore revision',
    kind: 'write',
    send: (a) => a.post(`${p()}/revisions/1/restore`).send({ baseUpdatedAt: plan.updatedAt }),
  },
  { name: 'GET shares', kind: 'write', send: (a) => a.get(`${p()}/shares`) },
  { name: 'POST share link', kind: 'write', send: (a) => a.post(`${p()}/shares`).send({ kind: 'link' }) },
  { name: 'DELETE share (unknown id)', kind: 'write', send: (a) => a.delete(`${p()}/shares/no-such-share`) },
  {
    name: 'PATCH photo caption',
    kind: 'write',
    send: (a) => a.patch(`${p()}/photos/${photoId}`).send({ caption: 'Cord entry, left side' }),
  },
  { name: 'DELETE photo (unknown id)', kind: 'write', send: (a) => a.delete(`${p()}/photos/no-such-photo`) },
  { name: 'DELETE plan', kind: 'write', send: (a) => a.delete(p()) },
];

/** The status each actor should get; the owner's "unknown id" deletes are a 404 of the share or photo itself. */
function expected(route: Route, actor: Actor): number | 'ok' {
  if (actor === 'anonymous') return 401;
  if (actor === 'owner') return route.name.includes('unknown id') ? 404 : 'ok';
  if (actor === 'recipient') return route.kind === 'read' ? 'ok' : 403;
  return 404;
}

describe('plan routes by caller', () => {
  for (const route of routes) {
    it(`${route.name}: owner and recipient as designed, everyone else refused`, async () => {
      // The owner last, so a delete does not hide the plan from the other callers' checks.
      for (const actor of [...ACTORS.filter((a) => a !== 'owner'), 'owner' as const]) {
        const res = await route.send(agents[actor]);
        const want = expected(route, actor);
        const seen = `${actor} → ${res.status}`;
        if (want === 'ok') expect(res.status < 300, seen).toBe(true);
        else {
          expect(seen).toBe(`${actor} → ${want}`);
          if (res.type === 'application/json') ErrorBodySchema.parse(res.body);
        }
      }
      if (route.name === 'DELETE plan') {
        // Undo, so the plan is there for whatever runs next.
        expect((await agents.owner.post(`${p()}/undelete`)).status).toBe(200);
        expect((await agents.recipient.post(`${p()}/undelete`)).status).toBe(404);
      }
    });
  }

  it('a revoked share stops the recipient at once', async () => {
    expect((await agents.recipient.get(p())).status).toBe(200);
    expect((await agents.owner.delete(`${p()}/shares/${shareId}`)).status).toBe(204);
    expect((await agents.recipient.get(p())).status).toBe(404);
    const left = PlanShareListSchema.parse((await agents.owner.get(`${p()}/shares`)).body);
    expect(left.items.map((s) => s.kind)).toEqual(['link']); // the link made by the matrix above
  });
});

describe("a trainee's plan", () => {
  it('is open to the instructor it is shared with, read-only, and to no other trainee or instructor', async () => {
    const trainee = await signedInAgent(server, 'trainee');
    const instructor = await signedInAgent(server, 'instructor');
    const work = await createPlan(trainee.agent, minimalPlan('Drill 3, my wiring'));
    expect((await instructor.agent.get(`/api/plans/${work.id}`)).status).toBe(404);

    await trainee.agent
      .post(`/api/plans/${work.id}/shares`)
      .send({ kind: 'user', email: instructor.user.email.toUpperCase() });

    const seen = await instructor.agent.get(`/api/plans/${work.id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.access).toBe('viewer');
    expect(seen.body.ownerName).toBe('Test trainee');
    const edit = await instructor.agent
      .put(`/api/plans/${work.id}`)
      .send({ document: minimalPlan('Marked'), baseUpdatedAt: work.updatedAt });
    expect(edit.status).toBe(403);
    expect((await agents.instructor.get(`/api/plans/${work.id}`)).status).toBe(404);
    expect((await agents.trainee.get(`/api/plans/${work.id}`)).status).toBe(404);
  });
});
