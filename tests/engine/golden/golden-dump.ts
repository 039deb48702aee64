/**
 * The engine's answers on every example plan, as sorted-key JSON: evaluations (initial state, each example state
 * through the sim command, the states the sweep keeps), the sweep, the cure and the cured plan, lead tables,
 * plan and action checks. tests/engine/golden-dump.test.ts compares them with the committed files in this folder,
 * so a change of structure that changes any answer fails.
 *
 *   npm run -s golden              # compare, exit 1 on a difference
 *   npm run -s golden -- --write   # write the files again (only when an answer is meant to change)
 */
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { run } from '../../../server/cli/sim';
import {
  actionProblem,
  applyCure,
  canConnect,
  checkRequired,
  cure,
  evaluate,
  initialState,
  leadTable,
  readState,
  sweep,
  validatePlan,
  type Plan,
  type SimAction,
} from '../../../shared/engine';

const here = fileURLToPath(new URL('.', import.meta.url));
const examples = join(here, '../../../shared/engine/examples');
const stateDir = join(examples, 'states');

export const GOLDEN_DIR = here;

/** Example plan files, by name without the extension. */
export function examplePlanNames(): string[] {
  return readdirSync(examples)
    .filter((f) => f.endsWith('.json'))
    .map((f) => basename(f, '.json'))
    .sort();
}

/** JSON with every object's keys in sorted order, so the text depends on values only. */
export function sortedJson(value: unknown): string {
  const sortKeys = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(sortKeys);
    if (v && typeof v === 'object') {
      return Object.fromEntries(
        Object.keys(v)
          .sort()
          .map((k) => [k, sortKeys((v as Record<string, unknown>)[k])]),
      );
    }
    return v;
  };
  return `${JSON.stringify(sortKeys(value), null, 1)}\n`;
}

function readPlan(file: string): Plan {
  const checked = validatePlan(JSON.parse(readFileSync(file, 'utf8')));
  if (!checked.ok) throw new Error(`${file}: ${JSON.stringify(checked.issues)}`);
  return checked.plan;
}

/** The sim command on the plan with one state file: exit status and what it wrote. */
function simRun(planFile: string, args: string[]) {
  let out = '';
  let err = '';
  const status = run(
    [planFile, ...args],
    (t) => (out += t),
    (t) => (err += t),
  );
  // Messages name the files; keep the golden text independent of where the checkout lives.
  return { status, out: out ? JSON.parse(out) : null, err: err.replaceAll(examples, '<examples>') };
}

/** Actions that do not fit the plan, for actionProblem's wording. */
function badActions(plan: Plan): SimAction[] {
  const set = plan.sets[0]?.id ?? 'none';
  return [
    { kind: 'lift-handset', set: 'ghost' },
    { kind: 'press-key', set, key: 99 },
    { kind: 'hands-free', set, on: true },
    { kind: 'ring-line', line: 29 },
    { kind: 'intercom-call', station: 'nowhere' },
    { kind: 'press-key', set, key: 1 },
  ];
}

/** Broken copies of the plan, for validatePlan's issues and paths. */
function brokenPlans(plan: Plan): unknown[] {
  const copy = () => JSON.parse(JSON.stringify(plan)) as Plan;
  const out: unknown[] = [];
  const a = copy();
  if (a.sets[0]) a.sets[0].template = 'no-such-template';
  out.push(a);
  const b = copy();
  if (b.cables[0]) b.cables[0].to = { part: 'ghost', port: 'jack-9' };
  out.push(b);
  const c = copy();
  if (c.cables[0] && c.cables[1]) c.cables[1].from = c.cables[0].from;
  out.push(c);
  const d = copy();
  if (d.sets[0]) d.sets[0].station = 'nowhere';
  if (d.addOns[0]) d.addOns[0].serves = 'ghost';
  out.push(d);
  out.push({ ...copy(), version: 2 });
  return out;
}

/** Everything the golden file of one example plan holds. */
export function goldenDump(name: string): unknown {
  const planFile = join(examples, `${name}.json`);
  const plan = readPlan(planFile);
  const parts = [...plan.sets.map((s) => s.id), ...plan.addOns.map((a) => a.id)];
  const swept = sweep(plan);
  const cured = cure(plan);
  const curedPlan = applyCure(plan, cured);
  const states = readdirSync(stateDir)
    .filter((f) => f.endsWith('.json'))
    .sort();
  return {
    plan: name,
    initial: evaluate(plan, initialState(plan)),
    initialNoPaths: evaluate(plan, initialState(plan), { paths: false }),
    states: Object.fromEntries(states.map((f) => [f, simRun(planFile, ['--state', join(stateDir, f)])])),
    keptStates: swept.findings.slice(0, 6).map((f) => evaluate(plan, f.state)),
    sweep: swept,
    sweepReduced: sweep(plan, { strategy: 'reduced' }),
    cure: cured,
    curedPlan,
    curedInitial: evaluate(curedPlan, initialState(curedPlan)),
    curedRequired: checkRequired(curedPlan),
    required: checkRequired(plan),
    leadTables: Object.fromEntries(parts.map((id) => [id, leadTable(plan, id)])),
    curedLeadTables: Object.fromEntries(parts.map((id) => [id, leadTable(curedPlan, id)])),
    actionProblems: badActions(plan).map((a) => actionProblem(plan, a)),
    stateFiles: [
      ...badActions(plan).map((a) => readState(plan, [a])),
      readState(plan, badActions(plan)),
      readState(plan, [{ kind: 'bogus' }]),
      readState(plan, swept.findings[0]?.actions ?? []),
      readState(plan, {
        sets: {
          ghost: { offHook: true },
          ...(plan.sets[0] ? { [plan.sets[0].id]: { pressedKey: 99, handsFreeOn: true } } : {}),
        },
        lines: [{ line: 29 }],
        intercom: { calling: 'nowhere' },
      }),
      readState(plan, { sets: 'no' }),
    ],
    brokenPlans: brokenPlans(plan).map((p) => validatePlan(p)),
    canConnect: plan.cables.flatMap((c) => [
      canConnect(plan, c.from, c.to),
      canConnect(plan, c.to, c.to),
      canConnect(plan, { part: 'ghost', port: 'cord' }, c.to),
      canConnect(plan, c.from, { part: c.to.part, port: 'no-port' }),
    ]),
  };
}

export function goldenFile(name: string): string {
  return join(GOLDEN_DIR, `${name}.json`);
}

function main(argv: string[]): number {
  const write = argv.includes('--write');
  let differ = 0;
  for (const name of examplePlanNames()) {
    const text = sortedJson(goldenDump(name));
    if (write) {
      writeFileSync(goldenFile(name), text);
      process.stdout.write(`wrote ${goldenFile(name)}\n`);
      continue;
    }
    const current = existsSync(goldenFile(name)) ? readFileSync(goldenFile(name), 'utf8') : '';
    if (current !== text) {
      differ++;
      process.stderr.write(`${name}: differs from ${goldenFile(name)}\n`);
    }
  }
  return differ > 0 ? 1 : 0;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  process.exitCode = main(process.argv.slice(2));
}
