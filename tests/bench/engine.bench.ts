/**
 * Engine benchmark (npm run bench): not a test. Every figure is the median of at least five runs (CPU time of this
 * process, so other work on a shared machine does not count; the wall-time median is printed beside it).
 *
 * The floor of an evaluation is what no evaluation of that state can avoid: a bare union-find over the state's
 * closed contacts only, on the static nets the engine solves once per plan (the netlist's dense components), with
 * no observations and no findings.
 */
import { loadavg } from 'node:os';
import {
  applyCure,
  createMech,
  cureOptimal,
  evaluate,
  evaluateNets,
  fillMech,
  getNetlist,
  sweep,
  type LeadChange,
  type Plan,
  type SimState,
} from '../../shared/engine/index';
import { busyState, examplePlan, largePlan, setsOnOneAdapter } from './bench-plans';

interface Figure {
  median: number;
  wall: number;
  runs: number;
}

const cpuMs = (since: NodeJS.CpuUsage) => {
  const d = process.cpuUsage(since);
  return (d.user + d.system) / 1000;
};
const medianOf = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/**
 * Median of at least `runs` samples (and at least minMs of sampling); each sample times `batch` calls, after
 * `warmUp` calls. A figure of steady work needs a few hundred calls first: before them the code runs unoptimised,
 * and the compiler's own threads count in this process's cpu time.
 */
async function measure(
  fn: () => unknown,
  opts: { runs?: number; minMs?: number; batch?: number; warmUp?: number } = {},
): Promise<Figure> {
  const batch = opts.batch ?? 1;
  const runs = opts.runs ?? 5;
  const minMs = opts.minMs ?? 300;
  for (let i = 0; i < (opts.warmUp ?? 1); i++) await fn();
  const cpu: number[] = [];
  const wall: number[] = [];
  const start = performance.now();
  while (cpu.length < runs || performance.now() - start < minMs) {
    const t = performance.now();
    const c = process.cpuUsage();
    for (let i = 0; i < batch; i++) await fn();
    cpu.push(cpuMs(c) / batch);
    wall.push((performance.now() - t) / batch);
    if (cpu.length >= 2000) break;
  }
  return { median: medianOf(cpu), wall: medianOf(wall), runs: cpu.length };
}

/**
 * The floor: the engine's per-state union-find (evaluateNets), which unions the closed contacts only over the
 * pre-solved static nets, with no observations or findings.
 */
function floorFor(plan: Plan, state: SimState): () => unknown {
  const nl = getNetlist(plan);
  const mech = fillMech(nl, state, createMech(nl));
  return () => evaluateNets(nl, mech);
}

/**
 * One edit as the Bench makes it, a new plan object per call (the netlist cache is keyed by the object): a lead
 * change on the middle set, added and removed in turn, with every other part kept as it was.
 */
function editor(plan: Plan): () => Plan {
  const at = Math.floor(plan.sets.length / 2);
  const lift: LeadChange = { kind: 'lift', pair: 2, conductor: 'both' };
  let current = plan;
  return () => {
    const set = current.sets[at];
    const leadChanges = set.leadChanges.length ? [] : [lift];
    current = { ...current, sets: current.sets.map((s, i) => (i === at ? { ...set, leadChanges } : s)) };
    return current;
  };
}

const ms = (x: number) => (x >= 1 ? `${x.toFixed(2)} ms` : `${(x * 1000).toFixed(1)} µs`);

async function main(): Promise<void> {
  const plans: [string, Plan][] = [
    ['2 sets', examplePlan('demo-plan.json')],
    ['10 sets', largePlan(3, 10)],
    ['40 sets', largePlan(10)],
  ];
  const rows: Record<string, string | number>[] = [];
  const row = (what: string, f: Figure, extra: Record<string, string | number> = {}) =>
    rows.push({
      case: what,
      'median (cpu)': ms(f.median),
      'median (wall)': ms(f.wall),
      runs: f.runs,
      ...extra,
    });
  const targets: { label: string; value: number; limit: number; unit: 'ms' | '×' | 'yes' }[] = [];

  for (const [name, plan] of plans) {
    const state = busyState(plan);
    const floor = await measure(floorFor(plan, state), { batch: 200, warmUp: 2000 });
    const warm = await measure(() => evaluate(plan, state), { batch: 20, warmUp: 500 });
    const warmNoPaths = await measure(() => evaluate(plan, state, { paths: false }), {
      batch: 20,
      warmUp: 500,
    });
    const edited = editor(plan);
    const afterEdit = await measure(() => evaluate(edited(), state), { batch: 5, warmUp: 200 });
    row(`floor, ${name}`, floor);
    row(`warm evaluation with paths, ${name}`, warm, {
      'vs floor': `${(warm.median / floor.median).toFixed(1)}×`,
    });
    row(`warm evaluation, paths off, ${name}`, warmNoPaths, {
      'vs floor': `${(warmNoPaths.median / floor.median).toFixed(1)}×`,
    });
    row(`evaluation after an edit (one lead lifted or restored, new plan object), ${name}`, afterEdit);
    if (name === '40 sets') {
      targets.push(
        {
          label: 'evaluation after an edit <= 2 ms at 40 sets',
          value: afterEdit.median,
          limit: 2,
          unit: 'ms',
        },
        {
          label: 'warm evaluation with paths <= 10x the floor (40 sets)',
          value: warm.median / floor.median,
          limit: 10,
          unit: '×',
        },
        {
          label: 'warm evaluation without paths <= 3x the floor (40 sets)',
          value: warmNoPaths.median / floor.median,
          limit: 3,
          unit: '×',
        },
      );
    }
  }

  const sweepPlans: [string, Plan, number][] = [
    ['3 sets', setsOnOneAdapter(3, 'six-key-hf'), 100],
    ['10 sets', largePlan(3, 10), Number.NaN],
    ['40 sets', largePlan(10), 1000],
  ];
  // The 40-set layout after its cure: too large to visit, complete only by the clean proof.
  const forty = largePlan(10);
  const curedForty = applyCure(forty, await cureOptimal(forty));
  sweepPlans.push(['cured 40 sets', curedForty, Number.NaN]);
  for (const [name, plan, limit] of sweepPlans) {
    const result = sweep(plan);
    const f = await measure(() => sweep(plan), { runs: 5, minMs: 0 });
    row(`default sweep, ${name}`, f, {
      states: result.statesVisited,
      findings: result.findings.length,
      complete: String(result.complete),
    });
    if (!result.complete) console.log(`default sweep, ${name}: ${result.incompleteReason}`);
    if (plan === curedForty)
      targets.push({
        label: `default sweep complete at ${name}`,
        value: result.complete ? 1 : 0,
        limit: 1,
        unit: 'yes',
      });
    if (!Number.isNaN(limit)) {
      targets.push({ label: `default sweep <= ${limit} ms at ${name}`, value: f.median, limit, unit: 'ms' });
      targets.push({
        label: `default sweep complete (sound) at ${name}`,
        value: result.complete ? 1 : 0,
        limit: 1,
        unit: 'yes',
      });
    }
  }

  const curePlans: [string, Plan, number][] = [
    ['2 sets', examplePlan('demo-plan.json'), 250],
    ['4 sets', setsOnOneAdapter(4, 'six-key-hf'), Number.NaN],
    ['40 sets', largePlan(10), 2000],
  ];
  for (const [name, plan, limit] of curePlans) {
    const result = await cureOptimal(plan);
    const f = await measure(() => cureOptimal(plan), { runs: 5, minMs: 0 });
    row(`cure (integer program), ${name}`, f, {
      changes: result.changes.length,
      ok: String(result.ok),
      rounds: result.rounds,
      verified: result.verifiedBy,
    });
    if (!Number.isNaN(limit))
      targets.push({ label: `cure <= ${limit} ms at ${name}`, value: f.median, limit, unit: 'ms' });
  }

  const load = loadavg().map((x) => x.toFixed(2));
  console.log(`Leadbench engine benchmark — node ${process.version}, load average ${load.join(' ')}`);
  console.table(rows);
  let missed = 0;
  for (const t of targets) {
    const pass = t.unit === 'yes' ? t.value >= 1 : t.value <= t.limit;
    if (!pass) missed++;
    const shown =
      t.unit === 'ms' ? ms(t.value) : t.unit === '×' ? `${t.value.toFixed(2)}×` : t.value ? 'yes' : 'no';
    console.log(`${pass ? 'PASS' : 'MISS'}  ${t.label}  (measured ${shown})`);
  }
  console.log(missed === 0 ? 'All targets met.' : `${missed} of ${targets.length} targets missed.`);
}

void main();
