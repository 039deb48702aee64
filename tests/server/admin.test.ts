import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { UserListSchema, UserSchema, type User } from '../../shared/schemas/auth.schema';
import { serverForFile, signedInAgent } from './server.harness';

const server = serverForFile();
let admin: Awaited<ReturnType<typeof signedInAgent>>;
const people: User[] = [];

beforeAll(async () => {
  admin = await signedInAgent(server, 'admin', 'zed.admin@listed.test');
  // Arrange a small, known population (names invented for the tests).
  const specs = [
    ['instructor', 'olga.lamp@listed.test'],
    ['trainee', 'tariq.hold@listed.test'],
    ['trainee', 'tess.ring@listed.test'],
    ['restorer', 'rita.tip@listed.test'],
  ] as const;
  for (const [role, email] of specs) people.push((await signedInAgent(server, role, email)).user);
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;

describe('who may use the admin routes', () => {
  it('refuses anonymous callers with 401', async () => {
    const res = await request(server.app).get('/api/admin/users');
    expect(res.status).toBe(401); // RFC 9110 §15.5.2
    expect(errorOf(res.body).code).toBe('UNAUTHENTICATED');
  });

  it.each(['trainee', 'instructor', 'restorer'] as const)('refuses a %s with 403', async (role) => {
    const { agent } = await signedInAgent(server, role);
    const list = await agent.get('/api/admin/users');
    const change = await agent.patch(`/api/admin/users/${people[0].id}`).send({ role: 'admin' });
    for (const res of [list, change]) {
      expect(res.status).toBe(403); // RFC 9110 §15.5.4: 403 when authenticated but not allowed
      expect(errorOf(res.body)).toEqual({
        code: 'FORBIDDEN',
        message: 'Your account does not have access to this.', // our own wording
      });
    }
  });
});

describe('GET /api/admin/users', () => {
  it('searches e-mail and name, case-insensitively', async () => {
    const res = await admin.agent.get('/api/admin/users').query({ search: 'TESS' });
    expect(res.status).toBe(200);
    const list = UserListSchema.parse(res.body);
    expect(list.items.map((u) => u.email)).toEqual(['tess.ring@listed.test']);
    expect(list.total).toBe(1);
  });

  it('treats % and _ in the search as plain characters', async () => {
    const res = await admin.agent.get('/api/admin/users').query({ search: '%' });
    expect(UserListSchema.parse(res.body).total).toBe(0); // no address or name here contains "%"
  });

  it('filters by role and sorts by e-mail', async () => {
    const res = await admin.agent
      .get('/api/admin/users')
      .query({ search: 'listed.test', role: 'trainee', sort: 'email', order: 'desc' });
    const list = UserListSchema.parse(res.body);
    expect(list.items.map((u) => u.email)).toEqual(['tess.ring@listed.test', 'tariq.hold@listed.test']);
  });

  it('pages through the list', async () => {
    const page1 = UserListSchema.parse(
      (
        await admin.agent
          .get('/api/admin/users')
          .query({ search: 'listed.test', sort: 'email', pageSize: 2, page: 1 })
      ).body,
    );
    const page3 = UserListSchema.parse(
      (
        await admin.agent
          .get('/api/admin/users')
          .query({ search: 'listed.test', sort: 'email', pageSize: 2, page: 3 })
      ).body,
    );
    expect(page1.total).toBe(5); // 1 admin + 4 arranged accounts on listed.test
    expect(page1).toMatchObject({ page: 1, pageSize: 2 });
    expect(page1.items.map((u) => u.email)).toEqual(['olga.lamp@listed.test', 'rita.tip@listed.test']); // alphabetical
    expect(page3.items.map((u) => u.email)).toEqual(['zed.admin@listed.test']);
  });

  it('explains a bad query', async () => {
    const res = await admin.agent.get('/api/admin/users').query({ pageSize: 1000, sort: 'password' });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(error.details ?? {}).sort()).toEqual(['pageSize', 'sort']); // UserListQuerySchema limits
  });
});

describe('PATCH /api/admin/users/:id', () => {
  it('changes a role, and the change applies to that user at once', async () => {
    const { agent, user } = await signedInAgent(server, 'trainee');
    const res = await admin.agent.patch(`/api/admin/users/${user.id}`).send({ role: 'instructor' });
    expect(res.status).toBe(200);
    expect(UserSchema.parse(res.body.user).role).toBe('instructor');
    const session = await agent.get('/api/auth/session');
    expect(session.body.user.role).toBe('instructor');
  });

  it('does not let an admin demote themselves', async () => {
    const res = await admin.agent.patch(`/api/admin/users/${admin.user.id}`).send({ role: 'trainee' });
    expect(res.status).toBe(403);
    expect(errorOf(res.body).message).toBe('You cannot remove your own admin role. Ask another admin.'); // our own wording
  });

  it('answers 404 for an unknown user', async () => {
    const res = await admin.agent.patch('/api/admin/users/no-such-user').send({ role: 'trainee' });
    expect(res.status).toBe(404); // RFC 9110 §15.5.5
    expect(errorOf(res.body)).toEqual({ code: 'NOT_FOUND', message: 'That user was not found.' });
  });

  it('refuses a role that does not exist', async () => {
    const res = await admin.agent.patch(`/api/admin/users/${people[0].id}`).send({ role: 'superuser' });
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).details ?? {})).toEqual(['role']);
  });
});
