/**
 * Classes and invitations through the API: invite by e-mail (read from the fake SMTP server), single-use expiring
 * links, joining as a new trainee or an existing account, resend, revoke, remove, and who may see which class.
 * Link lifetime, roles and messages are our own design (no published source).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import {
  ClassDetailSchema,
  ClassListSchema,
  InvitationInfoSchema,
  InviteResultSchema,
  MyClassListSchema,
} from '../../shared/schemas/training.schema';
import { signedInAgent, startTestServer, TEST_PASSWORD, uniqueEmail, type TestServer } from './server.harness';

let server: TestServer;
let instructor: Awaited<ReturnType<typeof signedInAgent>>;
let otherInstructor: Awaited<ReturnType<typeof signedInAgent>>;
let admin: Awaited<ReturnType<typeof signedInAgent>>;

beforeAll(async () => {
  server = await startTestServer();
  instructor = await signedInAgent(server, 'instructor');
  otherInstructor = await signedInAgent(server, 'instructor');
  admin = await signedInAgent(server, 'admin');
});
afterAll(async () => {
  await server.close();
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;

/** The newest invitation link sent to an address, read from the fake SMTP server. */
async function linkFor(email: string): Promise<string> {
  await expect.poll(() => server.smtp.messages.some((m) => m.to.includes(email))).toBe(true);
  const mail = server.smtp.messages.filter((m) => m.to.includes(email)).at(-1)!;
  const match = /\/drills\/join\/([A-Za-z0-9_-]+)/.exec(mail.raw.replace(/=\r?\n/g, ''));
  expect(match).not.toBeNull();
  return match![1];
}

async function newClass(name = 'Tuesday evening') {
  const res = await instructor.agent.post('/api/training/classes').send({ name });
  expect(res.status).toBe(201);
  return ClassDetailSchema.parse(res.body);
}

describe('classes and invitations', () => {
  it('invites a new trainee, who joins with a name and password and sees the class', async () => {
    const klass = await newClass();
    const email = uniqueEmail('newbie');
    const invited = await instructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: [email] });
    expect(invited.status).toBe(201);
    expect(InviteResultSchema.parse(invited.body).sent).toEqual([email]);
    const mail = server.smtp.messages.filter((m) => m.to.includes(email)).at(-1)!;
    expect(mail.subject).toContain('Tuesday evening');

    const token = await linkFor(email);
    const info = InvitationInfoSchema.parse((await request(server.app).get(`/api/training/invitations/${token}`)).body);
    expect(info).toEqual({ className: 'Tuesday evening', instructorName: 'Test instructor', email, accountExists: false });

    // Missing password: a clear message per field, nothing created.
    const incomplete = await request(server.app).post(`/api/training/invitations/${token}/accept`).send({ displayName: 'Ada' });
    expect(incomplete.status).toBe(400);
    expect(errorOf(incomplete.body).details?.password).toBeDefined();

    const trainee = request.agent(server.app);
    const accepted = await trainee
      .post(`/api/training/invitations/${token}/accept`)
      .send({ displayName: 'Ada Trainee', password: TEST_PASSWORD });
    expect(accepted.status).toBe(200);
    const session = await trainee.get('/api/auth/session');
    expect(session.body.user).toMatchObject({ email, role: 'trainee' });

    const mine = MyClassListSchema.parse((await trainee.get('/api/training/my/classes')).body);
    expect(mine.items.map((c) => c.name)).toEqual(['Tuesday evening']);

    // Single use: the same link no longer works.
    const again = await request(server.app).get(`/api/training/invitations/${token}`);
    expect(again.status).toBe(404);

    const roster = ClassDetailSchema.parse((await instructor.agent.get(`/api/training/classes/${klass.id}`)).body).roster;
    expect(roster).toEqual([expect.objectContaining({ kind: 'member', email, status: 'joined', displayName: 'Ada Trainee' })]);
  });

  it('links an existing account, which must be signed in as the invited address', async () => {
    const klass = await newClass('Saturday workshop');
    const existing = await signedInAgent(server, 'restorer');
    await instructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: [existing.user.email] });
    const token = await linkFor(existing.user.email);
    expect((await request(server.app).get(`/api/training/invitations/${token}`)).body.accountExists).toBe(true);

    const anonymous = await request(server.app).post(`/api/training/invitations/${token}/accept`).send({});
    expect(anonymous.status).toBe(401);
    const wrongPerson = await otherInstructor.agent.post(`/api/training/invitations/${token}/accept`).send({});
    expect(wrongPerson.status).toBe(403);

    expect((await existing.agent.post(`/api/training/invitations/${token}/accept`).send({})).status).toBe(200);
    const roster = ClassDetailSchema.parse((await instructor.agent.get(`/api/training/classes/${klass.id}`)).body).roster;
    expect(roster.map((r) => [r.email, r.status])).toEqual([[existing.user.email, 'joined']]);
    // The account keeps its role.
    expect((await existing.agent.get('/api/auth/session')).body.user.role).toBe('restorer');
  });

  it('resends (the old link stops working), revokes, and shows who has not joined', async () => {
    const klass = await newClass('Resend and revoke');
    const [a, b] = [uniqueEmail('pending'), uniqueEmail('revoked')];
    await instructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: [a, b] });
    const firstToken = await linkFor(a);
    let roster = ClassDetailSchema.parse((await instructor.agent.get(`/api/training/classes/${klass.id}`)).body).roster;
    expect(roster.map((r) => r.status)).toEqual(['pending', 'pending']);

    const inviteA = roster.find((r) => r.email === a)!;
    const before = server.smtp.messages.length;
    const resent = await instructor.agent.post(`/api/training/classes/${klass.id}/invitations/${inviteA.invitationId}/resend`);
    expect(resent.status).toBe(200);
    await expect.poll(() => server.smtp.messages.length).toBe(before + 1);
    const secondToken = await linkFor(a);
    expect(secondToken).not.toBe(firstToken);
    expect((await request(server.app).get(`/api/training/invitations/${firstToken}`)).status).toBe(404);
    expect((await request(server.app).get(`/api/training/invitations/${secondToken}`)).status).toBe(200);

    const inviteB = roster.find((r) => r.email === b)!;
    const tokenB = await linkFor(b);
    expect((await instructor.agent.delete(`/api/training/classes/${klass.id}/invitations/${inviteB.invitationId}`)).status).toBe(204);
    expect((await request(server.app).get(`/api/training/invitations/${tokenB}`)).status).toBe(404);
    roster = ClassDetailSchema.parse((await instructor.agent.get(`/api/training/classes/${klass.id}`)).body).roster;
    expect(roster.map((r) => r.email)).toEqual([a]);
  });

  it('refuses an expired link', async () => {
    const klass = await newClass('Expired');
    const email = uniqueEmail('late');
    await instructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: [email] });
    const token = await linkFor(email);
    await server.db('training_invitations').where({ email }).update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    const res = await request(server.app).post(`/api/training/invitations/${token}/accept`).send({ displayName: 'Late', password: TEST_PASSWORD });
    expect(res.status).toBe(404);
    expect(errorOf(res.body).message).toMatch(/expired/);
    const roster = ClassDetailSchema.parse((await instructor.agent.get(`/api/training/classes/${klass.id}`)).body).roster;
    expect(roster[0].status).toBe('expired');
  });

  it('removes a trainee from the roster', async () => {
    const klass = await newClass('Removal');
    const member = await signedInAgent(server, 'trainee');
    await instructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: [member.user.email] });
    await member.agent.post(`/api/training/invitations/${await linkFor(member.user.email)}/accept`).send({});
    expect((await instructor.agent.delete(`/api/training/classes/${klass.id}/members/${member.user.id}`)).status).toBe(204);
    expect(MyClassListSchema.parse((await member.agent.get('/api/training/my/classes')).body).items).toEqual([]);
  });

  it('shows instructors only their own classes, admins every class, trainees none of the staff routes', async () => {
    const klass = await newClass('Private to one instructor');
    const mineOnly = ClassListSchema.parse((await otherInstructor.agent.get('/api/training/classes')).body);
    expect(mineOnly.items.map((c) => c.id)).not.toContain(klass.id);
    expect((await otherInstructor.agent.get(`/api/training/classes/${klass.id}`)).status).toBe(404);
    expect((await otherInstructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: ['x@bench.test'] })).status).toBe(404);
    const all = ClassListSchema.parse((await admin.agent.get('/api/training/classes')).body);
    expect(all.items.map((c) => c.id)).toContain(klass.id);
    const trainee = await signedInAgent(server, 'trainee');
    expect((await trainee.agent.get('/api/training/classes')).status).toBe(403);
    expect((await request(server.app).get('/api/training/classes')).status).toBe(401);
  });

  it('answers bad input with a clear message', async () => {
    const res = await instructor.agent.post('/api/training/classes').send({ name: '' });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).details?.name).toEqual(['Name the class']);
    const klass = await newClass('Bad e-mails');
    const bad = await instructor.agent.post(`/api/training/classes/${klass.id}/invitations`).send({ emails: ['not-an-address'] });
    expect(bad.status).toBe(400);
  });
});
