import { createHash } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { PlanListSchema } from '../../shared/schemas/plans.schema';
import { SessionInfoSchema } from '../../shared/schemas/auth.schema';
import { SESSION_COOKIE } from '../../server/auth/sessions';
import { signedInAgent, serverForFile, TEST_PASSWORD, uniqueEmail } from './server.harness';

const server = serverForFile();

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;
const sessionCookie = (res: request.Response): string | undefined =>
  ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .findLast((c) => c.startsWith(`${SESSION_COOKIE}=`));

describe('POST /api/auth/sign-up', () => {
  it('creates a restorer account, signs it in and sets an HttpOnly SameSite=Lax cookie', async () => {
    // Arrange
    const email = uniqueEmail('new');
    // Act
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: `  ${email.toUpperCase()} `, displayName: ' Ada Reel ', password: TEST_PASSWORD });
    // Assert
    expect(res.status).toBe(201); // RFC 9110 §15.3.2: 201 Created for a new resource
    const { user } = SessionInfoSchema.parse(res.body);
    expect(user).toMatchObject({ email, displayName: 'Ada Reel', role: 'restorer' }); // new accounts are restorers (product rule); e-mail trimmed and lower-cased by EmailSchema
    const cookie = sessionCookie(res)!;
    // OWASP Session Management Cheat Sheet: session cookies HttpOnly, SameSite; Secure only when served over https
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    expect(cookie).toMatch(/Max-Age=2592000/); // SESSION_ABSOLUTE_HOURS default 720 × 3600 s (30 days)
  });

  it('sends a welcome mail through the mailer', async () => {
    const email = uniqueEmail('mail');
    await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email, displayName: 'Mae Welcome', password: TEST_PASSWORD });
    // The mail is sent after the answer; wait for the fake SMTP server to receive it.
    const mail = await vi.waitFor(
      () => {
        const found = server.smtp.messages.find((m) => m.to.includes(email));
        if (!found) throw new Error('not yet');
        return found;
      },
      { timeout: 5000 },
    );
    expect(mail.subject).toBe('Welcome to Leadbench'); // our own wording, server/auth/auth.service.ts
    expect(mail.raw).toContain('Mae Welcome');
  });

  it('gives the new account the demo plan', async () => {
    const { agent } = await signedInAgent(server);
    const res = await agent.get('/api/plans');
    expect(PlanListSchema.parse(res.body).items).toHaveLength(1); // product rule: one demo plan per new account
  });

  it('refuses an e-mail that already has an account', async () => {
    const email = uniqueEmail('dup');
    await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email, displayName: 'First', password: TEST_PASSWORD });
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email, displayName: 'Second', password: TEST_PASSWORD });
    expect(res.status).toBe(409); // RFC 9110 §15.5.10: 409 Conflict with the current state
    const error = errorOf(res.body);
    expect(error.code).toBe('EMAIL_TAKEN');
    expect(error.message).toBe('An account with that e-mail already exists. Sign in instead.'); // our own wording
    expect(error.details?.email).toEqual(['An account with that e-mail already exists']);
  });

  it('refuses a short password with a field message', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), displayName: 'Shorty', password: 'elevenchars' });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.details?.password).toEqual(['Use at least 12 characters']); // OWASP ASVS 2.1.1 minimum, message from PasswordSchema
  });

  it('names every missing field', async () => {
    const res = await request(server.app).post('/api/auth/sign-up').send({});
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.message).toBe('Some fields need attention.'); // our own wording, server/http/error-handler.ts
    // messages from shared/schemas/auth.schema.ts
    expect(error.details).toEqual({
      email: ['Enter an e-mail address'],
      displayName: ['Enter your name'],
      password: ['Enter a password'],
    });
  });

  it('refuses a malformed e-mail address', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: 'not-an-address', displayName: 'X', password: TEST_PASSWORD });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).details?.email).toEqual(['Enter a valid e-mail address']); // EmailSchema wording
  });

  it('answers bad JSON with 400 BAD_JSON', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .set('Content-Type', 'application/json')
      .send('{"email": "a@b.test",');
    expect(res.status).toBe(400);
    expect(errorOf(res.body)).toEqual({ code: 'BAD_JSON', message: 'The request body is not valid JSON.' });
  });

  it('answers a body over 1 MB with 413 PAYLOAD_TOO_LARGE', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .set('Content-Type', 'application/json')
      .send(
        JSON.stringify({ email: 'a@b.test', displayName: 'x'.repeat(1_100_000), password: TEST_PASSWORD }),
      );
    expect(res.status).toBe(413); // RFC 9110 §15.5.14: 413 Content Too Large
    expect(errorOf(res.body)).toEqual({
      code: 'PAYLOAD_TOO_LARGE',
      message: 'The request body is too large.',
    });
  });

  it('refuses a request from another site', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .set('Origin', 'https://elsewhere.example')
      .send({ email: uniqueEmail(), displayName: 'Cross', password: TEST_PASSWORD });
    expect(res.status).toBe(403); // OWASP CSRF Prevention Cheat Sheet: verify the Origin header
    const error = errorOf(res.body);
    expect(error.code).toBe('BAD_ORIGIN');
    expect(error.message).toBe('This request came from another site and was refused.'); // our own wording
  });

  it('accepts the app origin and refuses an origin that only matches its own Host (ASVS 4.0.3 V13.2.3)', async () => {
    const fromPublic = await request(server.app)
      .post('/api/auth/sign-up')
      .set('Origin', 'http://localhost:3000') // PUBLIC_ORIGIN derived from PORT=3000 in the harness
      .send({ email: uniqueEmail(), displayName: 'Same Site', password: TEST_PASSWORD });
    expect(fromPublic.status).toBe(201);
    const fromHost = await request(server.app)
      .post('/api/auth/sign-up')
      .set('Host', 'evil.example:3301')
      .set('Origin', 'http://evil.example:3301')
      .send({ email: uniqueEmail(), displayName: 'Dev Proxy', password: TEST_PASSWORD });
    expect(fromHost.status).toBe(403); // the Host header is the sender's choice; only PUBLIC_ORIGIN counts
    expect(errorOf(fromHost.body).code).toBe('BAD_ORIGIN');
  });

  it('refuses a Referer from another site when Origin is absent', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-in')
      .set('Referer', 'https://elsewhere.example/page')
      .send({ email: 'a@b.test', password: 'whatever' });
    expect(res.status).toBe(403);
    expect(errorOf(res.body).code).toBe('BAD_ORIGIN');
  });
});

describe('POST /api/auth/sign-in', () => {
  const email = uniqueEmail('signin');
  beforeAll(async () => {
    await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email, displayName: 'Sig Nin', password: TEST_PASSWORD });
  });

  it('signs in with the right password and starts a session', async () => {
    const agent = request.agent(server.app);
    const res = await agent.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(SessionInfoSchema.parse(res.body).user?.email).toBe(email);
    const session = await agent.get('/api/auth/session');
    expect(SessionInfoSchema.parse(session.body).user?.email).toBe(email);
  });

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const wrong = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'not the password' });
    const unknown = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('nobody'), password: TEST_PASSWORD });
    // OWASP Authentication Cheat Sheet: generic error that does not reveal whether the account exists
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(errorOf(res.body)).toEqual({
        code: 'BAD_CREDENTIALS',
        message: 'That e-mail and password do not match an account.', // our own wording
      });
      expect(sessionCookie(res)).toBeUndefined();
    }
  });

  it('asks for the missing password', async () => {
    const res = await request(server.app).post('/api/auth/sign-in').send({ email });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).details?.password).toEqual(['Enter your password']); // SignInSchema wording
  });

  it('issues a new session id on every sign-in and ends the old one', async () => {
    const agent = request.agent(server.app);
    const first = sessionCookie(
      await agent.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }),
    );
    const second = sessionCookie(
      await agent.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }),
    );
    expect(second).not.toBe(first); // OWASP Session Management Cheat Sheet: renew the session id on sign-in
    const replay = await request(server.app).get('/api/auth/session').set('Cookie', first!.split(';')[0]);
    expect(SessionInfoSchema.parse(replay.body).user).toBeNull();
  });
});

describe('session, sign-out and password change', () => {
  it('reports no user without a session', async () => {
    const res = await request(server.app).get('/api/auth/session');
    expect(res.status).toBe(200);
    expect(SessionInfoSchema.parse(res.body)).toEqual({ user: null });
  });

  it('signs out: clears the cookie and ends the session on the server', async () => {
    const { agent, user } = await signedInAgent(server);
    const res = await agent.post('/api/auth/sign-out');
    expect(res.status).toBe(204);
    expect(sessionCookie(res)).toMatch(/Max-Age=0/); // RFC 6265 §5.2.2: Max-Age 0 expires the cookie
    expect(await server.db('sessions').where({ user_id: user.id })).toHaveLength(0);
    const after = await agent.get('/api/auth/session');
    expect(SessionInfoSchema.parse(after.body).user).toBeNull();
  });

  it('clears a cookie whose session has expired', async () => {
    const { agent, user } = await signedInAgent(server);
    await server
      .db('sessions')
      .where({ user_id: user.id })
      .update({ expires_at: Date.now() - 1000 });
    const res = await agent.get('/api/auth/session');
    expect(SessionInfoSchema.parse(res.body).user).toBeNull();
    expect(sessionCookie(res)).toMatch(/Max-Age=0/);
  });

  it('ends a busy session at its absolute end, without renewing it (ASVS 4.0.3 V3.3.1)', async () => {
    const { agent, user } = await signedInAgent(server);
    const soon = Date.now() + 2000;
    await server.db('sessions').where({ user_id: user.id }).update({ expires_at: soon });
    const res = await agent.get('/api/auth/session');
    expect(SessionInfoSchema.parse(res.body).user?.id).toBe(user.id);
    expect(sessionCookie(res)).toBeUndefined(); // no renewal: the absolute end stays
    const row = await server.db('sessions').where({ user_id: user.id }).first();
    expect(Number(row.expires_at)).toBe(soon);
  });

  it('ends a session left idle past SESSION_IDLE_HOURS (ASVS 4.0.3 V3.3.2)', async () => {
    const { agent, user } = await signedInAgent(server);
    const idleHours = 168; // the documented default, server/config.ts
    await server
      .db('sessions')
      .where({ user_id: user.id })
      .update({ last_used_at: Date.now() - idleHours * 3_600_000 - 1000 });
    const res = await agent.get('/api/auth/session');
    expect(SessionInfoSchema.parse(res.body).user).toBeNull();
    expect(sessionCookie(res)).toMatch(/Max-Age=0/);
  });

  it('stores only the SHA-256 of the session id (ASVS 4.0.3 V3.2.3, V2.10.3)', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail('hash'), displayName: 'Hash Only', password: TEST_PASSWORD });
    const token = /=([^;]+)/.exec(sessionCookie(res)!)![1];
    const { user } = SessionInfoSchema.parse(res.body);
    const row = await server.db('sessions').where({ user_id: user!.id }).first();
    expect(row.id).toBe(createHash('sha256').update(token).digest('hex')); // FIPS 180-4 SHA-256, hex
    expect(row.id).not.toBe(token);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32); // 256 bits; ASVS V3.2.2 asks for at least 64
  });

  it('changes the password and signs out every other session', async () => {
    const email = uniqueEmail('pw');
    const { agent } = await signedInAgent(server, 'restorer', email);
    const other = request.agent(server.app);
    await other.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD });
    const newPassword = 'a brand new passphrase';

    const res = await agent.post('/api/auth/password').send({ currentPassword: TEST_PASSWORD, newPassword });

    expect(res.status).toBe(204);
    expect(SessionInfoSchema.parse((await agent.get('/api/auth/session')).body).user?.email).toBe(email);
    expect(SessionInfoSchema.parse((await other.get('/api/auth/session')).body).user).toBeNull();
    const oldPw = await request(server.app)
      .post('/api/auth/sign-in')
      .send({ email, password: TEST_PASSWORD });
    expect(oldPw.status).toBe(401);
    const newPw = await request(server.app).post('/api/auth/sign-in').send({ email, password: newPassword });
    expect(newPw.status).toBe(200);
  });

  it('refuses a password change with the wrong current password', async () => {
    const { agent } = await signedInAgent(server);
    const res = await agent
      .post('/api/auth/password')
      .send({ currentPassword: 'not my password', newPassword: 'another long passphrase' });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.details?.currentPassword).toEqual(['The current password is not right']); // our own wording
  });

  it('refuses a new password equal to the current one', async () => {
    const { agent } = await signedInAgent(server);
    const res = await agent
      .post('/api/auth/password')
      .send({ currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).details?.newPassword).toEqual([
      'Choose a password different from the current one',
    ]); // ChangePasswordSchema
  });

  it('needs a session to change the password', async () => {
    const res = await request(server.app)
      .post('/api/auth/password')
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'another long passphrase' });
    expect(res.status).toBe(401); // RFC 9110 §15.5.2: 401 when authentication is missing
    expect(errorOf(res.body)).toEqual({ code: 'UNAUTHENTICATED', message: 'Sign in to continue.' });
  });
});

describe('stored password hashes', () => {
  it('use argon2id with m=19456, t=2, p=1', async () => {
    const { user } = await signedInAgent(server);
    const row = await server.db('users').where({ id: user.id }).first();
    // OWASP Password Storage Cheat Sheet, argon2id minimum: 19 MiB memory, 2 iterations, parallelism 1;
    // encoded as a PHC string by the argon2 reference implementation (version 0x13 = 19).
    expect(row.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$[A-Za-z0-9+/]+\$[A-Za-z0-9+/]+$/);
    expect(row.password_hash).not.toContain(TEST_PASSWORD);
  });
});
