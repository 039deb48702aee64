/** Sharing a plan read-only by e-mail (mail through the fake SMTP server) or by a link that can be revoked. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import {
  LinkOpenedSchema,
  PlanShareListSchema,
  ShareCreatedSchema,
} from '../../shared/schemas/plan-shares.schema';
import { PlanListSchema, PlanRecordSchema } from '../../shared/schemas/plans.schema';
import { minimalPlan, planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';
import { createPlan } from './plans-fixtures';

let server: TestServer;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let friend: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  server = await startTestServer();
  owner = await signedInAgent(server);
  friend = await signedInAgent(server);
});
afterAll(async () => {
  await server.close();
});

describe('sharing by e-mail', () => {
  it('mails the person, lists the plan under "shared with me", and lets them copy it', async () => {
    const plan = await createPlan(owner.agent, planWithSets(2, 'Shared workshop'));
    const res = await owner.agent
      .post(`/api/plans/${plan.id}/shares`)
      .send({ kind: 'user', email: friend.user.email });
    expect(res.status).toBe(201);
    const created = ShareCreatedSchema.parse(res.body);
    expect(created).toMatchObject({
      mailed: true,
      url: null,
      share: { kind: 'user', email: friend.user.email },
    });

    // Quoted-printable soft line breaks (RFC 2045 §6.7) undone so the link reads whole.
    const body = (raw: string) => raw.replace(/=\r?\n/g, '');
    const shareMails = () =>
      server.smtp.messages.filter(
        (m) => m.to.includes(friend.user.email) && body(m.raw).includes(`/plans/${plan.id}`),
      );
    await expect.poll(() => shareMails().length).toBe(1);
    expect(body(shareMails()[0]!.raw)).toContain('Shared workshop');

    const shared = PlanListSchema.parse((await friend.agent.get('/api/plans?scope=shared')).body);
    expect(shared.items.map((p) => [p.id, p.access, p.ownerName])).toEqual([
      [plan.id, 'viewer', 'Test restorer'],
    ]);
    const mine = PlanListSchema.parse((await owner.agent.get('/api/plans?q=Shared workshop')).body);
    expect(mine.items[0]).toMatchObject({ shared: true, access: 'owner' });

    const copy = await friend.agent.post(`/api/plans/${plan.id}/duplicate`).send({});
    expect(copy.status).toBe(201);
    expect(PlanRecordSchema.parse(copy.body)).toMatchObject({
      access: 'owner',
      name: 'Copy of Shared workshop',
    });
  });

  it('refuses a bad address and sharing with oneself', async () => {
    const plan = await createPlan(owner.agent, minimalPlan('Not shared'));
    const bad = await owner.agent
      .post(`/api/plans/${plan.id}/shares`)
      .send({ kind: 'user', email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(Object.keys(ErrorBodySchema.parse(bad.body).error.details ?? {})).toEqual(['email']);
    const self = await owner.agent
      .post(`/api/plans/${plan.id}/shares`)
      .send({ kind: 'user', email: owner.user.email });
    expect(ErrorBodySchema.parse(self.body).error.details?.email).toEqual([
      'Enter the address of someone else',
    ]);
  });
});

describe('sharing by link', () => {
  it('opens for whoever holds the link until the owner revokes it, then stops at once', async () => {
    const plan = await createPlan(owner.agent, minimalPlan('Linked'));
    const created = ShareCreatedSchema.parse(
      (await owner.agent.post(`/api/plans/${plan.id}/shares`).send({ kind: 'link' })).body,
    );
    const token = created.url!.split('/shared/')[1]!;
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/); // 32 random bytes in base64url (RFC 4648 §5)
    expect(await server.db('plan_shares').where({ token_hash: token }).first()).toBeUndefined(); // only the hash is kept

    expect((await friend.agent.get(`/api/plans/${plan.id}`)).status).toBe(404);
    const opened = await friend.agent.post(`/api/links/${token}/open`);
    expect(LinkOpenedSchema.parse(opened.body).planId).toBe(plan.id);
    expect(PlanRecordSchema.parse((await friend.agent.get(`/api/plans/${plan.id}`)).body).access).toBe(
      'viewer',
    );
    const list = PlanShareListSchema.parse((await owner.agent.get(`/api/plans/${plan.id}/shares`)).body);
    expect(list.items).toMatchObject([{ kind: 'link', visitors: 1 }]);

    expect((await owner.agent.delete(`/api/plans/${plan.id}/shares/${created.share.id}`)).status).toBe(204);
    expect((await friend.agent.get(`/api/plans/${plan.id}`)).status).toBe(404);
    expect((await friend.agent.post(`/api/links/${token}/open`)).status).toBe(404);
    expect((await owner.agent.delete(`/api/plans/${plan.id}/shares/${created.share.id}`)).status).toBe(404);
  });

  it('refuses a malformed or unknown link, and anyone signed out', async () => {
    expect((await friend.agent.post('/api/links/short/open')).status).toBe(400);
    expect((await friend.agent.post(`/api/links/${'a'.repeat(43)}/open`)).status).toBe(404);
    const { default: request } = await import('supertest');
    expect((await request(server.app).post(`/api/links/${'a'.repeat(43)}/open`)).status).toBe(401);
  });
});
