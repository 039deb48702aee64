/**
 * API benchmark (npm run bench:api): not a test. Loads one saved plan through the real app (session check,
 * visibility check, logging, security headers) and through a bare Express 5 + better-sqlite3 route returning
 * the same row (`bare/api-route.ts`). Each server runs in its own process, so the load generator (autocannon,
 * 50 connections on 127.0.0.1, in this process) never shares an event loop with what it measures. The two
 * are loaded in turn for several rounds, the order swapped every round, so a noisy neighbour on the machine
 * hits both alike; the medians of the rounds are compared. Target: real p99 at most 2× the bare route's.
 *
 * BENCH_SECONDS (5) is the length of one measured run, BENCH_ROUNDS (5) the number of rounds; BENCH_CPU_PROF=<dir>
 * writes a V8 CPU profile of each server process there (open it in Chrome's DevTools) to see where the time goes.
 */
import { fork, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
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
const DURATION_S = Number(process.env.BENCH_SECONDS ?? 5);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 5);
const P99_TARGET = 2;
const PASSWORD = 'lamp lead wink cadence';

interface Run {
  rps: number;
  p99: number;
  /** CPU time (user + system) the server process spent per answered request, in microseconds. */
  cpuUs: number;
  failed: number;
}

type Server = { child: ChildProcess; url: string };

/** The server process's CPU time so far (both servers answer a 'cpu' message with process.cpuUsage()). */
function cpuOf({ child }: Server): Promise<number> {
  return new Promise((resolve) => {
    child.once('message', (m) => {
      const { user, system } = (m as { cpu: NodeJS.CpuUsage }).cpu;
      resolve(user + system);
    });
    child.send('cpu');
  });
}

/** The real app on the given database, with production logging (to a discarded stream); prints its URL. */
async function serveReal(file: string): Promise<void> {
  const db = openDatabase(file);
  const mailer = createMailer({ host: '127.0.0.1', port: 9, from: 'bench@leadbench.test', plain: true });
  const config = loadConfig({ LOG_LEVEL: 'info', PORT: '3000', PLAN_WRITES_PER_MINUTE: '1000' });
  const logger = pino({ level: 'info' }, pino.destination({ dest: '/dev/null', sync: false }));
  const app = createApp({ db, config, mailer, logger, clientDir: join(file, '..', 'none') });
  const server = app.listen(0, '127.0.0.1', () => {
    const address = server.address();
    if (address && typeof address === 'object') process.send?.({ url: `http://127.0.0.1:${address.port}` });
  });
  process.on('message', () => process.send?.({ cpu: process.cpuUsage() }));
  process.on('disconnect', () => {
    server.close();
    mailer.close();
    void db.destroy();
  });
}

/** Starts a server process and waits for the URL it listens on. */
function start(script: string, args: string[]): Promise<Server> {
  const profile = process.env.BENCH_CPU_PROF;
  const execArgv = profile
    ? [...process.execArgv, '--cpu-prof', `--cpu-prof-dir=${profile}`]
    : process.execArgv;
  const child = fork(script, args, { execArgv });
  return new Promise((resolve, reject) => {
    child.once('message', (m) => resolve({ child, url: (m as { url: string }).url }));
    child.once('exit', (code) => reject(new Error(`${script} exited with ${code} before listening`)));
  });
}

async function load(server: Server, url: string, headers: Record<string, string>): Promise<Run> {
  // Imported here, not at the top: the real server's process runs this file too and must not load it.
  const { default: autocannon } = await import('autocannon');
  // A short warm-up so both servers are measured hot.
  await autocannon({ url, connections: CONNECTIONS, duration: 1, headers });
  const cpuBefore = await cpuOf(server);
  const r = await autocannon({ url, connections: CONNECTIONS, duration: DURATION_S, headers });
  const cpuUs = ((await cpuOf(server)) - cpuBefore) / Math.max(r.requests.total, 1);
  return { rps: r.requests.average, p99: r.latency.p99, cpuUs, failed: r.errors + r.non2xx };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
};

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'leadbench-bench-'));
  const file = join(dir, 'bench.sqlite');
  const db = openDatabase(file);
  await migrateLatest(db);
  const user = (await usersRepo(db).create({
    email: 'bench@leadbench.test',
    displayName: 'Bench Runner',
    role: 'restorer',
    passwordHash: await hashPassword(PASSWORD),
  }))!;
  const plan = await plansRepo(db).create(user.id, examplePlan('demo-plan.json'));
  await db.destroy();

  const self = fileURLToPath(import.meta.url);
  const real = await start(self, ['serve', file]);
  const bare = await start(join(self, '..', 'bare', 'api-route.ts'), [file, user.id]);
  const signIn = await fetch(`${real.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: user.email, password: PASSWORD }),
  });
  const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
  if (!signIn.ok || !cookie) throw new Error(`bench sign-in failed: ${signIn.status}`);
  const sides = {
    bare: {
      name: 'bare Express + better-sqlite3',
      server: bare,
      url: `${bare.url}/plans/${plan.id}`,
      headers: {},
    },
    real: {
      name: 'GET /api/plans/:id',
      server: real,
      url: `${real.url}/api/plans/${plan.id}`,
      headers: { cookie },
    },
  };
  const [realBody, bareBody] = await Promise.all([
    fetch(sides.real.url, { headers: sides.real.headers }).then(
      (r) => r.json() as Promise<{ document: unknown }>,
    ),
    fetch(sides.bare.url).then((r) => r.json() as Promise<{ document: unknown }>),
  ]);
  if (JSON.stringify(realBody.document) !== JSON.stringify(bareBody.document))
    throw new Error('the two routes do not return the same document');

  console.log(
    `autocannon: ${CONNECTIONS} connections, ${DURATION_S} s per run, ${ROUNDS} rounds alternating, 127.0.0.1`,
  );
  const line = (label: string, name: string, r: Run) =>
    console.log(
      `${label.padStart(5)}  ${name.padEnd(30)} ${r.rps.toFixed(0).padStart(7)} ${r.p99.toFixed(1).padStart(9)} ${r.cpuUs.toFixed(0).padStart(10)} ${String(r.failed).padStart(7)}`,
    );
  console.log('round  route                            req/s    p99 ms  CPU µs/req  failed');
  const runs = { bare: [] as Run[], real: [] as Run[] };
  for (let round = 1; round <= ROUNDS; round++) {
    const order = round % 2 ? (['bare', 'real'] as const) : (['real', 'bare'] as const);
    for (const side of order) {
      const r = await load(sides[side].server, sides[side].url, sides[side].headers);
      runs[side].push(r);
      line(String(round), sides[side].name, r);
    }
  }

  const med = (side: 'bare' | 'real'): Run => ({
    rps: median(runs[side].map((r) => r.rps)),
    p99: median(runs[side].map((r) => r.p99)),
    cpuUs: median(runs[side].map((r) => r.cpuUs)),
    failed: runs[side].reduce((n, r) => n + r.failed, 0),
  });
  const m = { bare: med('bare'), real: med('real') };
  console.log('median of rounds');
  for (const side of ['bare', 'real'] as const) line('', sides[side].name, m[side]);
  const p99Ratio = m.real.p99 / Math.max(m.bare.p99, 0.1);
  const rpsRatio = m.real.rps / m.bare.rps;
  const cpuRatio = m.real.cpuUs / Math.max(m.bare.cpuUs, 1);
  console.log(
    `ratios of medians (real / bare): req/s ${rpsRatio.toFixed(2)}, CPU per request ${cpuRatio.toFixed(2)}, p99 ${p99Ratio.toFixed(2)} (target ≤ ${P99_TARGET})`,
  );

  const misses: string[] = [];
  if (p99Ratio > P99_TARGET)
    misses.push(`p99 is ${p99Ratio.toFixed(2)}× the bare route (target ≤ ${P99_TARGET}×)`);
  if (m.real.failed) misses.push(`${m.real.failed} failed requests on the real route`);
  console.log(misses.length ? `Falls short: ${misses.join('; ')}` : 'All targets met');

  real.child.disconnect();
  bare.child.disconnect();
  await Promise.all([real, bare].map(({ child }) => new Promise((r) => child.once('exit', r))));
  rmSync(dir, { recursive: true, force: true });
  process.exitCode = misses.length ? 1 : 0;
}

if (process.argv[2] === 'serve') await serveReal(process.argv[3]);
else await main();
