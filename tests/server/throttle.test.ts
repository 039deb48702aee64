/**
 * Failed sign-in throttling (ASVS 4.0.3 V2.2.1: anti-automation against credential stuffing and brute
 * force; V11.1.4: business limits) and the sign-up budget per address.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { hashPassword } from '../../server/auth/password';
import { usersRepo } from '../../server/users/users.repo';
import {
  restartedApp,
  signedInAgent,
  serverForFile,
  startTestServer,
  TEST_PASSWORD,
  uniqueEmail,
  type TestServer,
} from './server.harness';

const env = {
  SIGN_IN_FAILURES_PER_ACCOUNT: '3',
  SIGN_IN_FAILURES_PER_ADDRESS: '5',
  TRUST_PROXY: '1',
  RATE_LIMIT_MAX: '3',
};
const server = serverForFile(env);

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;
const signIn = (app: TestServer['app'], email: string, password: string, forwardedFor = '203.0.113.9') =>
  request(app).post('/api/auth/sign-in').set('X-Forwarded-For', forwardedFor).send({ email, password });

describe('failed sign-ins per account (ASVS 4.0.3 V2.2.1)', () => {
  it('blocks the account after its failures and states the real wait', async () => {
    const { user } = await signedInAgent(server);
    for (let i = 0; i < 3; i++)
      expect((await signIn(server.app, user.email, 'wrong password!', `198.51.100.${i}`)).status).toBe(401);

    // Even the right password waits: otherwise the block would tell the attacker when they guessed it.
    const blocked = await signIn(server.app, user.email, TEST_PASSWORD, '198.51.100.50');
    expect(blocked.status).toBe(429); // RFC 6585 §4
    expect(errorOf(blocked.body)).toEqual({
      code: 'RATE_LIMITED',
      message: 'Too many failed sign-ins. Try again in 15 minutes.', // 15-minute window, server/config.ts
    });
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(14 * 60); // RFC 9110 §10.2.3, seconds

    // Eight minutes into the window, seven are left.
    await server
      .db('sign_in_failures')
      .where({ key: `account:${user.email}` })
      .update({ window_started_at: Date.now() - 8 * 60_000 });
    const later = await signIn(server.app, user.email, TEST_PASSWORD, '198.51.100.51');
    expect(errorOf(later.body).message).toBe('Too many failed sign-ins. Try again in 7 minutes.');
  });

  it('keeps counting across a restart (counters live in SQLite)', async () => {
    const { user } = await signedInAgent(server);
    for (let i = 0; i < 3; i++)
      await signIn(server.app, user.email, 'wrong password!', `198.51.100.${60 + i}`);
    const restarted = restartedApp(server, env);
    try {
      expect((await signIn(restarted.app, user.email, TEST_PASSWORD, '198.51.100.70')).status).toBe(429);
    } finally {
      restarted.close();
    }
  });
});

describe('failed sign-ins per address (ASVS 4.0.3 V2.2.1)', () => {
  it('lets a class of thirty sign in from one address within a minute: successes do not count', async () => {
    // Default sign-up budget and a tight failure budget per address: only failures may use it up.
    const classroom = await startTestServer({
      ...env,
      RATE_LIMIT_MAX: '20',
      SIGN_IN_FAILURES_PER_ADDRESS: '3',
    });
    try {
      // Thirty accounts, as an instructor's class would have (made directly: sign-ups are not what is tested).
      const users = usersRepo(classroom.db);
      const passwordHash = await hashPassword(TEST_PASSWORD);
      const trainees = await Promise.all(
        Array.from({ length: 30 }, (_, i) =>
          users.create({
            email: `class-${i + 1}@bench.test`,
            displayName: `Trainee ${i + 1}`,
            role: 'trainee',
            passwordHash,
          }),
        ),
      );
      // All at once from the classroom's one address (the 15-minute window covers them all).
      const answers = await Promise.all(
        trainees.map((t) => signIn(classroom.app, t!.email, TEST_PASSWORD, '192.0.2.30')),
      );
      expect(answers.map((a) => a.status)).toEqual(Array(30).fill(200));
      const counted = await classroom.db('sign_in_failures').where({ key: 'address:192.0.2.30' }).first();
      expect(counted).toBeUndefined(); // successes leave no trace in the failure counters

      // Two typos in the room still leave the rest of the class in (3 failures per address allowed here).
      for (let i = 0; i < 2; i++)
        expect(
          (await signIn(classroom.app, trainees[0]!.email, 'wrong password!', '192.0.2.30')).status,
        ).toBe(401);
      expect((await signIn(classroom.app, trainees[1]!.email, TEST_PASSWORD, '192.0.2.30')).status).toBe(200);
    } finally {
      await classroom.close();
    }
  });

  it('trusts only the configured proxy hop: a new X-Forwarded-For per attempt is still limited', async () => {
    // TRUST_PROXY=1: the address is the entry the one proxy appended (the right-most), whatever the
    // client wrote before it (Express "trust proxy" docs, hop count).
    const attempt = (i: number) =>
      signIn(server.app, uniqueEmail('nobody'), 'wrong password!', `10.${i}.0.1, 203.0.113.77`);
    for (let i = 0; i < 5; i++) expect((await attempt(i)).status).toBe(401);
    const res = await attempt(99);
    expect(res.status).toBe(429);
    expect(errorOf(res.body).message).toMatch(/^Too many failed sign-ins\. Try again in \d+ minutes\.$/);
  });
});

describe('sign-up budget per address', () => {
  it('answers 429 once RATE_LIMIT_MAX sign-ups are spent; other routes are not limited', async () => {
    const limited = await startTestServer({ RATE_LIMIT_MAX: '2' });
    try {
      for (let i = 0; i < 2; i++)
        expect((await request(limited.app).post('/api/auth/sign-up').send({})).status).toBe(400);
      const res = await request(limited.app).post('/api/auth/sign-up').send({});
      expect(res.status).toBe(429);
      expect(errorOf(res.body).code).toBe('RATE_LIMITED');
      expect((await request(limited.app).get('/api/auth/session')).status).toBe(200);
    } finally {
      await limited.close();
    }
  });
});
