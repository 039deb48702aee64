/** The account lifecycle through the API: verification, reset, profile, sessions, TOTP, export, deletion. */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { generate } from 'otplib';
import request from 'supertest';
import { describe, expect, it, vi } from 'vitest';
import {
  AccountExportSchema,
  AccountSchema,
  SessionListSchema,
  TotpEnrolmentSchema,
} from '../../shared/schemas/account.schema';
import { SessionInfoSchema } from '../../shared/schemas/auth.schema';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { DEMO_ACCOUNTS } from '../../db/seeds/demo-accounts.seed';
import { seedDemo } from '../../server/seed-demo';
import {
  decodeMail,
  mailTo,
  minimalPlan,
  signedInAgent,
  serverForFile,
  startTestServer,
  TEST_PASSWORD,
  tokenIn,
  uniqueEmail,
} from './server.harness';

const server = serverForFile({ EMAIL_VERIFICATION: 'true' });

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;
const NEW_PASSWORD = 'lamp lead wink cadence'; // zxcvbn score 4 (checked by the strength tests below)

describe('sign-up with e-mail verification (ASVS 4.0.3 V2.1.x, V3.x; enumeration: V2.5.x)', () => {
  it('answers a new and a taken address the same, and the mail says what happened', async () => {
    const fresh = uniqueEmail('fresh');
    const first = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: fresh, displayName: 'New Comer', password: TEST_PASSWORD });
    const again = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: fresh, displayName: 'Someone Else', password: TEST_PASSWORD });

    expect(first.status).toBe(202); // RFC 9110 §15.3.3: accepted, completion pending
    expect(again.status).toBe(first.status);
    expect(again.body).toEqual(first.body);
    expect(first.headers['set-cookie']).toBeUndefined();
    expect((await mailTo(server, fresh, /Confirm/)).subject).toBe('Confirm your Leadbench e-mail address');
    expect(decodeMail((await mailTo(server, fresh, /tried/)).raw)).toContain('already has one');
  });

  it('signs in only after the link is followed, and the link works once', async () => {
    const email = uniqueEmail('verify');
    await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email, displayName: 'Vera Fy', password: TEST_PASSWORD });
    const before = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: TEST_PASSWORD });
    expect(before.status).toBe(403);
    expect(errorOf(before.body).code).toBe('EMAIL_NOT_VERIFIED');

    // The refused sign-in sent a fresh link, which replaces the first one.
    const links = await vi.waitFor(() => {
      const found = server.smtp.messages.filter((m) => m.to.includes(email) && /Confirm/.test(m.subject));
      if (found.length < 2) throw new Error('second link not yet');
      return found;
    });
    const stale = tokenIn(links[0].raw);
    expect(
      errorOf((await request(server.app).post('/api/auth/verify-email').send({ token: stale })).body).code,
    ).toBe('BAD_TOKEN');
    const token = tokenIn(links[1].raw);
    expect((await request(server.app).post('/api/auth/verify-email').send({ token })).status).toBe(204);
    const reuse = await request(server.app).post('/api/auth/verify-email').send({ token });
    expect(errorOf(reuse.body).code).toBe('BAD_TOKEN');

    const after = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: TEST_PASSWORD });
    expect(after.status).toBe(200);
  });
});

describe('forgot password (ASVS 4.0.3 V2.5.2, V2.5.6)', () => {
  it('answers the same for unknown addresses and resets once with a single-use token', async () => {
    const { user } = await signedInAgent(server);
    const unknown = await request(server.app)
      .post('/api/auth/forgot-password')
      .send({ email: uniqueEmail('ghost') });
    const known = await request(server.app).post('/api/auth/forgot-password').send({ email: user.email });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(known.text).toBe(unknown.text);

    const token = tokenIn((await mailTo(server, user.email, /new Leadbench password/)).raw);
    const reset = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: NEW_PASSWORD });
    expect(reset.status).toBe(204);
    const again = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: NEW_PASSWORD });
    expect(errorOf(again.body).code).toBe('BAD_TOKEN');
    expect(await server.db('sessions').where({ user_id: user.id })).toHaveLength(0); // signed out everywhere
    const signIn = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: NEW_PASSWORD });
    expect(signIn.status).toBe(200);
    expect((await mailTo(server, user.email, /was changed/)).subject).toBe(
      'Your Leadbench password was changed',
    );
  });

  it('refuses an expired token', async () => {
    const { user } = await signedInAgent(server);
    await request(server.app).post('/api/auth/forgot-password').send({ email: user.email });
    const token = tokenIn((await mailTo(server, user.email, /new Leadbench password/)).raw);
    await server
      .db('account_tokens')
      .where({ user_id: user.id })
      .update({ expires_at: Date.now() - 1 });
    const res = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: NEW_PASSWORD });
    expect(errorOf(res.body).code).toBe('BAD_TOKEN');
  });
});

describe('password strength and change (ASVS 4.0.3 V2.1.7, V2.1.8, V2.2.3)', () => {
  it.each(['aaaaaaaaaaaa', 'passwordpassword'])('refuses the guessable %s', async (password) => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), displayName: 'Weak', password });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).details?.password?.[0]).toMatch(/^This password is easy to guess\./);
  });

  it('refuses a guessable new password on change and on reset as on sign-up', async () => {
    const { agent, user } = await signedInAgent(server);
    const change = await agent
      .post('/api/auth/password')
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'passwordpassword' });
    expect(change.status).toBe(400);
    expect(errorOf(change.body).details?.newPassword?.[0]).toMatch(/^This password is easy to guess\./);

    await request(server.app).post('/api/auth/forgot-password').send({ email: user.email });
    const token = tokenIn((await mailTo(server, user.email, /new Leadbench password/)).raw);
    const reset = await request(server.app)
      .post('/api/auth/reset-password')
      .send({ token, password: 'passwordpassword' });
    expect(reset.status).toBe(400);
    expect(errorOf(reset.body).details?.password?.[0]).toMatch(/^This password is easy to guess\./);
    // The refused reset did not use up the link.
    expect(
      (await request(server.app).post('/api/auth/reset-password').send({ token, password: NEW_PASSWORD }))
        .status,
    ).toBe(204);
  });

  it('mails the owner on change and limits changes with 429', async () => {
    const { agent, user } = await signedInAgent(server);
    const change = (current: string, next: string) =>
      agent.post('/api/auth/password').send({ currentPassword: current, newPassword: next });
    expect((await change(TEST_PASSWORD, NEW_PASSWORD)).status).toBe(204);
    expect(decodeMail((await mailTo(server, user.email, /was changed/)).raw)).toContain(
      'other devices were signed out',
    );
    const statuses = [];
    for (let i = 0; i < 5; i++) statuses.push((await change('not the password', NEW_PASSWORD + i)).status);
    expect(statuses.slice(0, 4)).toEqual([400, 400, 400, 400]);
    expect(statuses[4]).toBe(429); // 5 per 15 minutes per account, server/auth/auth.routes.ts
  });
});

describe('sessions list (ASVS 4.0.3 V3.3.4, V3.4.5)', () => {
  it('lists the sessions and signs out everywhere else', async () => {
    const { agent, user } = await signedInAgent(server);
    const laptop = request.agent(server.app);
    await laptop
      .post('/api/auth/sign-in')
      .set('User-Agent', 'Bench laptop')
      .send({ email: user.email, password: TEST_PASSWORD });
    const list = SessionListSchema.parse((await agent.get('/api/account/sessions')).body);
    expect(list.items).toHaveLength(2);
    expect(list.items.filter((s) => s.current)).toHaveLength(1);
    expect(list.items.map((s) => s.userAgent)).toContain('Bench laptop');

    const res = await agent.post('/api/account/sessions/sign-out-others');
    expect(res.body).toEqual({ ended: 1 });
    expect(SessionInfoSchema.parse((await laptop.get('/api/auth/session')).body).user).toBeNull();
    expect(SessionInfoSchema.parse((await agent.get('/api/auth/session')).body).user?.id).toBe(user.id);
  });

  it('names the cookie with the __Host- prefix when secure (RFC 6265bis §4.1.3.2)', async () => {
    const secure = await startTestServer({ SESSION_SECURE: 'true' });
    try {
      const res = await request(secure.app)
        .post('/api/auth/sign-up')
        .send({ email: uniqueEmail(), displayName: 'Host Only', password: TEST_PASSWORD });
      const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).join('\n');
      expect(cookie).toMatch(
        /^__Host-leadbench_session=[^;]+; Max-Age=\d+; Path=\/; Expires=[^;]+; HttpOnly; Secure; SameSite=Lax/,
      );
      expect(cookie).not.toMatch(/Domain=/i);
    } finally {
      await secure.close();
    }
  });
});

describe('TOTP second factor (ASVS 4.0.3 V2.8.1, RFC 6238)', () => {
  it('enrols with a text secret and asks for a code at the next sign-in', async () => {
    const { agent, user } = await signedInAgent(server);
    const enrol = TotpEnrolmentSchema.parse((await agent.post('/api/account/totp')).body);
    expect(enrol.secret).toMatch(/^[A-Z2-7]+=*$/); // RFC 4648 §6 base32 alphabet
    expect(enrol.uri).toMatch(/^otpauth:\/\/totp\/Leadbench:/);
    const wrong = await agent.post('/api/account/totp/confirm').send({ code: '000000' });
    expect(wrong.status).toBe(400);
    const ok = await agent
      .post('/api/account/totp/confirm')
      .send({ code: await generate({ secret: enrol.secret }) });
    expect(ok.status).toBe(204);

    const phone = request.agent(server.app);
    const first = await phone.post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    expect(SessionInfoSchema.parse(first.body)).toEqual({ user: null, secondFactorRequired: true });
    expect((await phone.get('/api/plans')).status).toBe(401); // not signed in until the code
    const code = await generate({ secret: enrol.secret });
    const second = await phone.post('/api/auth/second-factor').send({ code });
    expect(second.status).toBe(200);
    expect((await phone.get('/api/plans')).status).toBe(200);
  });
});

describe('profile, export and deletion (ASVS 4.0.3 V8.3.1, V8.3.2, V8.3.8)', () => {
  it('changes the name at once and the address only after it is confirmed', async () => {
    const { agent, user } = await signedInAgent(server);
    const next = uniqueEmail('moved');
    const res = await agent.patch('/api/account').send({ displayName: 'New Name', email: next });
    expect(res.body.emailPending).toBe(true);
    expect(AccountSchema.parse(res.body.account)).toMatchObject({
      displayName: 'New Name',
      email: user.email,
    });
    const token = tokenIn((await mailTo(server, next, /new Leadbench e-mail/)).raw);
    await request(server.app).post('/api/auth/verify-email').send({ token });
    expect(AccountSchema.parse((await agent.get('/api/account')).body).email).toBe(next);
  });

  it('downloads the account and its plans as JSON, then deletes both', async () => {
    const { agent, user } = await signedInAgent(server);
    await agent.post('/api/plans').send({ document: minimalPlan('Export me') });
    const res = await agent.get('/api/account/export');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?leadbench-account\.json"?$/);
    const data = AccountExportSchema.parse(res.body);
    expect(data.account.id).toBe(user.id);
    expect(data.plans.map((p) => p.name)).toContain('Export me');
    expect(JSON.stringify(data)).not.toMatch(/argon2|password_hash/);

    const wrong = await agent.delete('/api/account').send({ password: 'not the password' });
    expect(wrong.status).toBe(400);
    expect((await agent.delete('/api/account').send({ password: TEST_PASSWORD })).status).toBe(204);
    expect(await server.db('users').where({ id: user.id })).toHaveLength(0);
    expect(await server.db('plans').where({ owner_id: user.id })).toHaveLength(0);
  });
});

describe('demo accounts and the first admin (ASVS 4.0.3 V2.3.1, V2.4.x)', () => {
  it('gives each demo account its own salt and hash', async () => {
    const fresh = await startTestServer();
    try {
      await seedDemo(fresh.db);
      const hashes = (await fresh.db('users').select('password_hash')).map((r) => r.password_hash as string);
      expect(hashes).toHaveLength(DEMO_ACCOUNTS.length);
      expect(new Set(hashes).size).toBe(hashes.length);
      // PHC string format: $argon2id$v=19$m=…,t=…,p=…$salt$hash
      expect(new Set(hashes.map((h) => h.split('$')[4])).size).toBe(hashes.length);
    } finally {
      await fresh.close();
    }
  });

  it('admin:create prints a one-time password that must be changed, and admin routes need TOTP', async () => {
    const file = join(server.dir, 'admin-create.sqlite');
    const run = spawnSync('npx', ['tsx', 'server/tools/admin-create.ts', 'first.admin@bench.test'], {
      env: { ...process.env, DATABASE_FILE: file, LOG_LEVEL: 'silent' },
      encoding: 'utf8',
    });
    expect(run.status).toBe(0);
    const password = run.stdout.trim().split('\n').at(-1)!;
    expect(password).toMatch(/^[A-Za-z0-9_-]{24}$/);
    const { openDatabase } = await import('../../server/db/database');
    const db = openDatabase(file);
    const { createApp } = await import('../../server/app');
    const { loadConfig } = await import('../../server/config');
    const { createMailer } = await import('../../server/mail/mailer');
    const mailer = createMailer({
      host: server.smtp.host,
      port: server.smtp.port,
      from: 'b@leadbench.test',
      plain: true,
    });
    try {
      const app = createApp({ db, config: loadConfig({ LOG_LEVEL: 'silent' }), mailer });
      const agent = request.agent(app);
      const signIn = await agent
        .post('/api/auth/sign-in')
        .send({ email: 'first.admin@bench.test', password });
      expect(SessionInfoSchema.parse(signIn.body).mustChangePassword).toBe(true);
      expect(errorOf((await agent.get('/api/plans')).body).code).toBe('PASSWORD_CHANGE_REQUIRED');
      expect(
        (
          await agent
            .post('/api/auth/password')
            .send({ currentPassword: password, newPassword: NEW_PASSWORD })
        ).status,
      ).toBe(204);
      const admin = await agent.get('/api/admin/users');
      expect(admin.status).toBe(403);
      expect(errorOf(admin.body).code).toBe('SECOND_FACTOR_REQUIRED');
    } finally {
      mailer.close();
      await db.destroy();
    }
  });
});
