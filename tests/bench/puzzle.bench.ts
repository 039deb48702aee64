/**
 * Puzzle action round trip (npm run bench:puzzle): not a test. Starts the HTTP app on a fresh database, lets a
 * trainee work a shipped puzzle, and times POST /api/training/runs/:id/actions from request to parsed answer:
 * p50 and p99 over a sequence of real operating actions, printed as JSON.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pino } from 'pino';
import type { SimAction } from '../../shared/engine/index';
import { RunViewSchema } from '../../shared/schemas/training.schema';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { migrateLatest, openDatabase } from '../../server/db/database';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { createMailer } from '../../server/mail/mailer';
import { usersRepo } from '../../server/users/users.repo';

const ROUNDS = Number(process.env.ROUNDS ?? 400);
const SLUG = process.env.PUZZLE ?? 'back-office-two-faults';

const dir = mkdtempSync(join(tmpdir(), 'leadbench-puzzle-bench-'));
const db = openDatabase(join(dir, 'bench.sqlite'));
await migrateLatest(db);
const smtp = await startFakeSmtp();
const mailer = createMailer({ host: smtp.host, port: smtp.port, from: 'bench@leadbench.test', plain: true });
const config = loadConfig({ LOG_LEVEL: 'silent', RATE_LIMIT_MAX: '1000', PORT: '3000' });
const app = createApp({ db, config, mailer, logger: pino({ level: 'silent' }), clientDir: join(dir, 'none') });
const server = app.listen(0, '127.0.0.1');
await new Promise((r) => server.once('listening', r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

async function signUp(email: string): Promise<{ cookie: string; id: string }> {
  const res = await fetch(`${base}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, displayName: email.split('@')[0], password: 'bench-password-123' }),
  });
  const body = (await res.json()) as { user: { id: string } };
  return { cookie: res.headers.get('set-cookie')!.split(';')[0], id: body.user.id };
}

async function call<T = unknown>(cookie: string, method: string, path: string, body?: unknown): Promise<T> {
  const res = await fetch(`${base}${path}`, {
    method,
    headers: { Cookie: cookie, 'Content-Type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

const instructor = await signUp('bench-instructor@leadbench.test');
const trainee = await signUp('bench-trainee@leadbench.test');
await usersRepo(db).setRole(instructor.id, 'instructor');
const klass = await call<{ id: string }>(instructor.cookie, 'POST', '/api/training/classes', { name: 'Bench class' });
await db('training_members').insert({ class_id: klass.id, user_id: trainee.id, joined_at: new Date().toISOString() });
const puzzle = await call<{ id: string }>(instructor.cookie, 'POST', '/api/training/puzzles/from-library', { slug: SLUG });
const assignment = await call<{ id: string }>(instructor.cookie, 'POST', `/api/training/classes/${klass.id}/assignments`, {
  kind: 'puzzle',
  itemId: puzzle.id,
});
const run = RunViewSchema.parse(await call(trainee.cookie, 'POST', `/api/training/assignments/${assignment.id}/run`));

// A loop of everyday operating: take a line, hold it, ring another, call the intercom, hang up.
const [a, b] = run.layout.sets.map((s) => s.id);
const cycle: SimAction[] = [
  { kind: 'press-key', set: a, key: 1 },
  { kind: 'lift-handset', set: a },
  { kind: 'press-key', set: b, key: 2 },
  { kind: 'lift-handset', set: b },
  { kind: 'press-hold', set: a },
  { kind: 'ring-line', line: 3 },
  { kind: 'stop-ringing', line: 3 },
  { kind: 'hang-up', set: b },
  { kind: 'intercom-call', station: run.layout.stations[0].id },
  { kind: 'intercom-end' },
  { kind: 'hang-up', set: a },
  { kind: 'release-keys', set: a },
];

const times: number[] = [];
for (let i = 0; i < ROUNDS; i++) {
  const started = performance.now();
  RunViewSchema.parse(await call(trainee.cookie, 'POST', `/api/training/runs/${run.id}/actions`, { action: cycle[i % cycle.length] }));
  times.push(performance.now() - started);
}
times.sort((x, y) => x - y);
const at = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))];
console.log(
  JSON.stringify({ puzzle: SLUG, rounds: ROUNDS, p50Ms: +at(0.5).toFixed(2), p99Ms: +at(0.99).toFixed(2), maxMs: +times.at(-1)!.toFixed(2) }),
);

server.close();
mailer.close();
await smtp.close();
await db.destroy();
rmSync(dir, { recursive: true, force: true });
