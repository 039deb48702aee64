/**
 * The sim command line, run as a separate process exactly as `npm run -s sim -- …` runs it.
 * Exit statuses, output fields and message wording are our own CLI contract (shared/engine/examples/README.md);
 * trade facts name their source beside the check.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { planBuilder } from '../support/plan-builder';

const root = join(__dirname, '../..');
const examples = join(root, 'shared/engine/examples');
const work = mkdtempSync(join(tmpdir(), 'leadbench-cli-'));

interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
  json(): any; // eslint-disable-line @typescript-eslint/no-explicit-any -- parsed CLI output, checked field by field
}

function sim(...args: string[]): Promise<Run> {
  return run('server/cli/sim.ts', args);
}

/** Runs a script under tsx the way npm run does, collecting its output. */
function run(script: string, args: string[]): Promise<Run> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', join(root, script), ...args], { cwd: root });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (d: string) => (stdout += d));
    child.stderr.setEncoding('utf8').on('data', (d: string) => (stderr += d));
    child.on('error', reject);
    child.on('close', (status) => resolve({ status, stdout, stderr, json: () => JSON.parse(stdout) }));
  });
}

function file(name: string, content: unknown): string {
  const path = join(work, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

function alonePlan() {
  const b = planBuilder('One set alone');
  const ksu = b.ksu({ lines: 3, stations: 1 });
  b.cable(ksu.port(1), b.set('six-key', 'Alone', { station: ksu.stations[0] }).cord);
  return b.input();
}

describe.concurrent('sim command line', { timeout: 60_000 }, () => {
  it('exits 0 and prints the evaluation when there is nothing wrong', async () => {
    const r = await sim(file('alone.json', alonePlan()));
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = r.json();
    expect(out.plan).toBe('One set alone');
    expect(out.evaluation.findings).toEqual([]);
    expect(out.evaluation.lines).toHaveLength(3);
  });

  it('exits 1 when the state shows a finding; a state file may be a list of actions', async () => {
    const actions = file('actions.json', [
      { kind: 'press-key', set: 'counter', key: 1 },
      { kind: 'press-key', set: 'bench', key: 5 },
      { kind: 'lift-handset', set: 'bench' },
    ]);
    const r = await sim(join(examples, 'two-set.json'), '--state', actions);
    expect(r.status).toBe(1);
    const out = r.json();
    // lifting the line-5 set lights line 1 too. Common practice, no published source.
    expect(out.evaluation.findings).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [1] });
    expect(out.state.sets.bench).toEqual({ offHook: true, pressedKey: 5, handsFreeOn: false });
  });

  it('takes a full state file', async () => {
    const r = await sim(
      join(examples, 'two-set.json'),
      '--state',
      join(examples, 'states/two-set-conference.json'),
    );
    expect(r.status).toBe(1);
    // different line keys on the two sets join their lines. Same source.
    expect(r.json().evaluation.findings).toHaveFinding('LINES_JOINED', { lines: [1, 5] });
  });

  it('adds the sweep and the cure on request', async () => {
    const r = await sim(join(examples, 'two-set.json'), '--sweep', '--cure');
    expect(r.status).toBe(1);
    const out = r.json();
    expect(out.sweep.strategy).toBe('exhaustive');
    expect(out.sweep.findings.length).toBeGreaterThan(0);
    expect(out.cure.ok).toBe(true);
    // three lifted pairs in one set. Same source.
    expect(out.cure.changes.map((c: { change: { pair: number } }) => c.change.pair)).toEqual([23, 24, 25]);
  });

  it('exits 2 on a file that is not JSON', async () => {
    const r = await sim(file('broken.json', '{ "version": 1,'));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/broken\.json: the plan file is not valid JSON/);
  });

  it('exits 2 with the exact path of a schema error', async () => {
    const plan = alonePlan();
    (plan.sets![0] as { id: string }).id = 'Not A Slug';
    const r = await sim(file('bad-id.json', plan));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bad-id\.json: sets\[0\]\.id: /);
  });

  it('exits 2 with the exact path of a cross-reference error', async () => {
    const plan = alonePlan();
    plan.sets![0].template = 'no-such-template';
    const r = await sim(file('bad-template.json', plan));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bad-template\.json: sets\[0\]\.template: /);
  });

  it('exits 2 on an action naming a set the plan does not have', async () => {
    const state = file('bad-action.json', [{ kind: 'lift-handset', set: 'nobody' }]);
    const r = await sim(join(examples, 'two-set.json'), '--state', state);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bad-action\.json: \[0\]\.set: No set with id "nobody"/);
  });

  it('exits 2 on a state whose key does not exist on the set', async () => {
    const state = file('bad-key.json', { sets: { counter: { offHook: true, pressedKey: 9 } } });
    const r = await sim(join(examples, 'two-set.json'), '--state', state);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/sets\.counter\.pressedKey: /);
  });

  it('exits 2 with usage on bad arguments or a missing file', async () => {
    expect((await sim()).status).toBe(2);
    const unknown = await sim(join(examples, 'two-set.json'), '--frobnicate');
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/usage:/);
    const missing = await sim(join(work, 'missing.json'));
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/cannot read the plan file \(ENOENT\)/);
  });

  it('the committed JSON Schema of the plan is the one PlanSchema generates', async () => {
    const r = await run('server/cli/write-json-schema.ts', ['--check']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
  });
});
