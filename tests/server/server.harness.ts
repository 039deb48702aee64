/**
 * A fresh app per test file: its own temp folder, migrated SQLite file and fake SMTP server,
 * so files run in parallel without sharing state.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, expect, vi } from 'vitest';
import type { Plan } from '../../shared/engine/document/plan.schema';
import { UserSchema, type Role, type User } from '../../shared/schemas/auth.schema';
import type { Logger } from 'pino';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { migrateLatest, openDatabase, type Database } from '../../server/db/database';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import { usersRepo } from '../../server/users/users.repo';

// Each sign-up or sign-in hashes with argon2id at the OWASP cost (19 MiB, 2 passes); a test doing several
// on a busy machine needs more than vitest's 5 s default. This is headroom, not a speed check.
vi.setConfig({ testTimeout: 30_000, hookTimeout: 30_000 });

export const TEST_PASSWORD = 'correct horse battery'; // 21 characters: above the 12-character minimum (OWASP ASVS 2.1.1)

/** A fixed base32 TOTP secret for test accounts (RFC 4648 §6 alphabet). */
export const TEST_TOTP_SECRET = 'JBSWY3DPEHPK3PXPJBSWY3DPEHPK3PXP';

export interface TestServer {
  app: Express;
  db: Database;
  smtp: FakeSmtp;
  dir: string;
  close(): Promise<void>;
}

export interface TestServerOptions {
  clientDir?: string;
  /** The app's logger; silent unless a test reads what is logged. */
  logger?: Logger;
}

const mailerTo = (smtp: FakeSmtp): Mailer =>
  createMailer({ host: smtp.host, port: smtp.port, from: 'bench@leadbench.test', plain: true });

const testConfig = (env: Record<string, string>) =>
  loadConfig({ LOG_LEVEL: 'silent', RATE_LIMIT_MAX: '1000', PORT: '3000', ...env });

export async function startTestServer(
  env: Record<string, string> = {},
  options: TestServerOptions = {},
): Promise<TestServer> {
  const dir = mkdtempSync(join(tmpdir(), 'leadbench-server-'));
  const db = openDatabase(join(dir, 'test.sqlite'));
  await migrateLatest(db);
  const smtp = await startFakeSmtp();
  const mailer = mailerTo(smtp);
  const config = testConfig({ DATABASE_FILE: join(dir, 'test.sqlite'), ...env });
  const app = createApp({
    db,
    config,
    mailer,
    logger: options.logger ?? pino({ level: 'silent' }),
    clientDir: options.clientDir ?? join(dir, 'no-client-build'),
  });
  return {
    app,
    db,
    smtp,
    dir,
    async close() {
      mailer.close();
      await smtp.close();
      await db.destroy();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/**
 * One server for the whole test file: started before its first test, closed after its last. The object is
 * filled in when the server has started, so tests use it as they would the server itself.
 */
export function serverForFile(env: Record<string, string> = {}, options: TestServerOptions = {}): TestServer {
  const server = {} as TestServer;
  beforeAll(async () => {
    Object.assign(server, await startTestServer(env, options));
  });
  afterAll(async () => {
    await server.close?.();
  });
  return server;
}

/**
 * A second app on the same database, as the server is after a restart; `close` ends only its mailer
 * (the database and the mail server stay with the first).
 */
export function restartedApp(server: TestServer, env: Record<string, string> = {}) {
  const mailer = mailerTo(server.smtp);
  const app = createApp({
    db: server.db,
    config: testConfig(env),
    mailer,
    logger: pino({ level: 'silent' }),
  });
  return { app, close: () => mailer.close() };
}

let counter = 0;
export const uniqueEmail = (prefix = 'user'): string => `${prefix}-${++counter}-${Date.now()}@bench.test`;

/** Signs up through the API, then sets the role directly, and returns a cookie-keeping agent. */
export async function signedInAgent(
  server: TestServer,
  role: Role = 'restorer',
  email = uniqueEmail(role),
): Promise<{ agent: ReturnType<typeof request.agent>; user: User }> {
  const agent = request.agent(server.app);
  const res = await agent
    .post('/api/auth/sign-up')
    .send({ email, displayName: `Test ${role}`, password: TEST_PASSWORD });
  if (res.status === 202) {
    // E-mail verification is on: follow the mailed link, then sign in.
    const token = tokenIn((await mailTo(server, email, /Confirm/)).raw);
    expect((await agent.post('/api/auth/verify-email').send({ token })).status).toBe(204);
    const signIn = await agent.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(200);
  } else {
    expect(res.status).toBe(201);
  }
  let user = UserSchema.parse((await agent.get('/api/auth/session')).body.user);
  if (role !== 'restorer') user = (await usersRepo(server.db).setRole(user.id, role))!;
  // Admin routes need a second factor (ASVS 4.0.3 V2.8); test admins are enrolled directly.
  if (role === 'admin') await usersRepo(server.db).setTotpSecret(user.id, TEST_TOTP_SECRET, true);
  return { agent, user };
}

/** A small valid plan: a KSU with two lines and no sets. */
export function minimalPlan(name = 'Workshop bench'): Plan {
  return {
    version: 1,
    name,
    description: 'Two lines on the bench KSU',
    ksu: {
      id: 'ksu',
      name: 'Bench KSU',
      lines: [
        { number: 1, label: 'Shop', directoryNumber: '5550101' },
        { number: 2, label: 'Office', directoryNumber: '5550102' },
      ],
      stations: [],
      ports: 4,
    },
    sets: [],
    addOns: [],
    adapters: [],
    cables: [],
    required: { allLinesOnEverySet: true, intercomPerStation: true, handsFreeSets: [] },
  };
}

/** A plan with `n` six-key sets (not yet cabled); the set count is derived from it. */
export function planWithSets(n: number, name = 'Front office'): Plan {
  const plan = minimalPlan(name);
  for (let i = 1; i <= n; i++) {
    plan.sets.push({
      id: `set-${i}`,
      name: `Desk ${i}`,
      template: 'six-key', // template id from shared/engine/templates/part-templates.ts
      ringerLines: [1],
      leadChanges: [],
      position: { x: i * 120, y: 200 },
    });
  }
  return plan;
}

/** Waits for the newest mail to `to` (optionally matching a subject) and returns it. */
export async function mailTo(server: TestServer, to: string, subject?: RegExp) {
  return vi.waitFor(
    () => {
      const found = server.smtp.messages.findLast(
        (m) => m.to.includes(to) && (!subject || subject.test(m.subject)),
      );
      if (!found) throw new Error(`no mail to ${to} yet`);
      return found;
    },
    { timeout: 5000 },
  );
}

/** The message with RFC 2045 §6.7 quoted-printable undone (soft line breaks, =XX escapes). */
export const decodeMail = (raw: string): string =>
  raw
    .replace(/=\r?\n/g, '')
    .replace(/=([0-9A-F]{2})/g, (_m, hex: string) => String.fromCharCode(parseInt(hex, 16)));

/** The token of the link in a mail (`?token=` followed by 43 base64url characters). */
export function tokenIn(raw: string): string {
  const match = /token=([A-Za-z0-9_-]{43})/.exec(decodeMail(raw));
  if (!match) throw new Error('no token link in the mail');
  return match[1];
}
