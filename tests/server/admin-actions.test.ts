/** Admin actions on accounts, each written to the audit log (ASVS 4.0.3 V7.1.3, V7.2.2, V4.1.1). */
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { AuditListSchema } from '../../shared/schemas/account.schema';
import { AdminUserSchema, UserListSchema } from '../../shared/schemas/auth.schema';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { mailTo, signedInAgent, serverForFile, TEST_PASSWORD, uniqueEmail } from './server.harness';

const server = serverForFile();
let admin: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  admin = await signedInAgent(server, 'admin');
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;
const auditActions = async () =>
  AuditListSchema.parse((await admin.agent.get('/api/admin/audit')).body).items.map((e) => e.action);

describe('admin actions', () => {
  it('disables (signing the person out) and re-enables an account', async () => {
    const person = await signedInAgent(server, 'trainee');
    const off = await admin.agent.patch(`/api/admin/users/${person.user.id}/status`).send({ disabled: true });
    expect(AdminUserSchema.parse(off.body.user).disabled).toBe(true);
    expect((await person.agent.get('/api/plans')).status).toBe(401);
    const signIn = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: person.user.email, password: TEST_PASSWORD });
    expect(errorOf(signIn.body).code).toBe('ACCOUNT_DISABLED');

    await admin.agent.patch(`/api/admin/users/${person.user.id}/status`).send({ disabled: false });
    const back = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: person.user.email, password: TEST_PASSWORD });
    expect(back.status).toBe(200);
    expect((await auditActions()).slice(0, 2)).toEqual(['account-enabled', 'account-disabled']);
  });

  it('shows each user’s last sign-in', async () => {
    const person = await signedInAgent(server, 'restorer');
    await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: person.user.email, password: TEST_PASSWORD });
    const list = UserListSchema.parse(
      (await admin.agent.get('/api/admin/users').query({ search: person.user.email })).body,
    );
    expect(list.items[0].lastSignInAt).not.toBeNull();
  });

  it('sends a password reset, invites with a role and deletes an account', async () => {
    const person = await signedInAgent(server, 'restorer');
    expect((await admin.agent.post(`/api/admin/users/${person.user.id}/password-reset`)).status).toBe(202);
    await mailTo(server, person.user.email, /new Leadbench password/);

    const email = uniqueEmail('invited');
    const invite = await admin.agent
      .post('/api/admin/invitations')
      .send({ email, displayName: 'In Vited', role: 'instructor' });
    expect(invite.status).toBe(201);
    expect(AdminUserSchema.parse(invite.body.user).role).toBe('instructor');
    expect((await mailTo(server, email, /invited/)).subject).toBe('You are invited to Leadbench');

    expect((await admin.agent.delete(`/api/admin/users/${person.user.id}`)).status).toBe(204);
    expect((await admin.agent.delete(`/api/admin/users/${person.user.id}`)).status).toBe(404);
    expect((await auditActions()).slice(0, 3)).toEqual([
      'account-deleted',
      'user-invited',
      'password-reset-sent',
    ]);
  });

  it('refuses to disable or delete the admin’s own account', async () => {
    const off = await admin.agent.patch(`/api/admin/users/${admin.user.id}/status`).send({ disabled: true });
    const del = await admin.agent.delete(`/api/admin/users/${admin.user.id}`);
    for (const res of [off, del]) expect(res.status).toBe(403);
  });

  it('keeps the audit log for admins only', async () => {
    const { agent } = await signedInAgent(server, 'instructor');
    expect((await agent.get('/api/admin/audit')).status).toBe(403);
    const entry = AuditListSchema.parse((await admin.agent.get('/api/admin/audit')).body).items[0];
    expect(entry.actorEmail).toBe(admin.user.email);
  });
});
