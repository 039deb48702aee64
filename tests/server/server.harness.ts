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
import { expect, vi } from 'vitest';
import type { Plan } from '../../shared/engine/document/plan.schema';
import { SessionInfoSchema, type Role, type User } from '../../shared/schemas/auth.schema';
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

export interface TestServer {
  app: Express;
  db: Database;
  smtp: FakeSmtp;
  dir: string;
  close(): Promise<void>;
}

export async function startTestServer(
  env: Record<string, string> = {},
  options: { clientDir?: string } = {},
): Promise<TestServer> {
  const dir = mkdtempSync(join(tmpdir(), 'leadbench-server-'));
  const db = openDatabase(join(dir, 'test.sqlite'));
  await migrateLatest(db);
  const smtp = await startFakeSmtp();
  const mailer: Mailer = createMailer({
    host: smtp.host,
    port: smtp.port,
    from: 'bench@leadbench.test',
    plain: true,
  });
  const config = loadConfig({
    LOG_LEVEL: 'silent',
    RATE_LIMIT_MAX: '1000',
    PORT: '3000',
    DATABASE_FILE: join(dir, 'test.sqlite'),
    ...env,
  });
  const app = createApp({
    db,
    config,
    mailer,
    logger: pino({ level: 'silent' }),
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
  expect(res.status).toBe(201);
  let user = SessionInfoSchema.parse(res.body).user!;
  if (role !== 'restorer') user = (await usersRepo(server.db).setRole(user.id, role))!;
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
