/**
 * API benchmark (npm run bench:api): not a test. Loads one saved plan through the real app (session
 * check, owner check, logging, security headers) and through a bare Express 5 + better-sqlite3 route
 * returning the same row, each with autocannon: 50 connections on 127.0.0.1. Prints req/s and p99 of
 * both, their ratios, and whether the target (real p99 at most 2× the bare route's) is met.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import BetterSqlite3 from 'better-sqlite3';
import express from 'express';
import { pino } from 'pino';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/auth/password';
import { loadConfig } from '../../server/config';
import { migrateLatest, openDatabase } from '../../server/db/database';
import { createMailer } from '../../server/mail/mailer';
import { plansRepo } from '../../server/plans/plans.repo';
import { usersRepo } from '../../server/users/users.repo';
import { examplePlan } from './bench-plans';

const CONNECTIONS = 50;
const DURATION_S = Number(process.env.BENCH_SECONDS ?? 8);
const P99_TARGET = 2;

interface Result {
  rps: number;
  p99: number;
  errors: number;
  non2xx: number;
}

async function load(url: string, headers: Record<string, string>): Promise<Result> {
  // A short warm-up so both servers are measured hot.
  await autocannon({ url, connections: CONNECTIONS, duration: 1, headers });
  const r = await autocannon({ url, connections: CONNECTIONS, duration: DURATION_S, headers });
  return { rps: r.requests.average, p99: r.latency.p99, errors: r.errors, non2xx: r.non2xx };
}

function listen(app: express.Express): Promise<{ url: string; close: () => Promise<void> }> {
  return new Promise((resolve) => {
    const server = app.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      resolve({ url: `http://127.0.0.1:${port}`, close: () => new Promise((r) => server.close(() => r())) });
    });
  });
}

const dir = mkdtempSync(join(tmpdir(), 'leadbench-bench-'));
const file = join(dir, 'bench.sqlite');
const db = openDatabase(file);
await migrateLatest(db);
const user = (await usersRepo(db).create({
  email: 'bench@leadbench.test',
  displayName: 'Bench Runner',
  role: 'restorer',
  passwordHash: await hashPassword('lamp lead wink cadence'),
}))!;
const plan = await plansRepo(db).create(user.id, examplePlan('demo-plan.json'));

// The real app, with its production logging (to a discarded stream) and a signed-in session.
const mailer = createMailer({ host: '127.0.0.1', port: 9, from: 'bench@leadbench.test', plain: true });
const config = loadConfig({ LOG_LEVEL: 'info', PORT: '3000', PLAN_WRITES_PER_MINUTE: '1000' });
const logger = pino({ level: 'info' }, pino.destination({ dest: '/dev/null', sync: false }));
const real = await listen(createApp({ db, config, mailer, logger, clientDir: join(dir, 'none') }));
const signIn = await fetch(`${real.url}/api/auth/sign-in`, {
  method: 'POST',
  headers: { 'content-type': 'application/json' },
  body: JSON.stringify({ email: user.email, password: 'lamp lead wink cadence' }),
});
const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
if (!signIn.ok || !cookie) throw new Error(`bench sign-in failed: ${signIn.status}`);

// The bare route: the same row, read and sent with nothing else.
const sqlite = new BetterSqlite3(file, { readonly: true });
const byIdAndOwner = sqlite.prepare('select * from plans where id = ? and owner_id = ?');
const bareApp = express();
bareApp.get('/plans/:id', (req, res) => {
  const row = byIdAndOwner.get(req.params.id, user.id) as Record<string, unknown> & { document: string };
  res.json({ ...row, document: JSON.parse(row.document) as unknown });
});
const bare = await listen(bareApp);

console.log(`autocannon: ${CONNECTIONS} connections, ${DURATION_S} s each, 127.0.0.1`);
const bareResult = await load(`${bare.url}/plans/${plan.id}`, {});
const realResult = await load(`${real.url}/api/plans/${plan.id}`, { cookie });

const rows = [
  ['bare Express + better-sqlite3', bareResult],
  ['GET /api/plans/:id', realResult],
] as const;
console.log('route                           req/s     p99 ms   errors  non-2xx');
for (const [name, r] of rows) {
  console.log(
    `${name.padEnd(30)} ${r.rps.toFixed(0).padStart(7)} ${r.p99.toFixed(1).padStart(9)} ${String(r.errors).padStart(8)} ${String(r.non2xx).padStart(8)}`,
  );
}
const p99Ratio = realResult.p99 / Math.max(bareResult.p99, 0.1);
const rpsRatio = realResult.rps / bareResult.rps;
console.log(
  `ratios (real / bare): req/s ${rpsRatio.toFixed(2)}, p99 ${p99Ratio.toFixed(2)} (target ≤ ${P99_TARGET})`,
);

const misses: string[] = [];
if (p99Ratio > P99_TARGET)
  misses.push(`p99 is ${p99Ratio.toFixed(2)}× the bare route (target ≤ ${P99_TARGET}×)`);
if (realResult.errors || realResult.non2xx)
  misses.push(`${realResult.errors + realResult.non2xx} failed requests`);
console.log(misses.length ? `Falls short: ${misses.join('; ')}` : 'All targets met');

await real.close();
await bare.close();
mailer.close();
sqlite.close();
await db.destroy();
rmSync(dir, { recursive: true, force: true });
process.exitCode = misses.length ? 1 : 0;
