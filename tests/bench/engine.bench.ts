/**
 * Engine benchmark (npm run bench): not a test. Prints a table (median, p95, ops/s, ratio to the floor) and PASS or
 * MISS for each speed target on this machine. The floor is a bare union-find over the same netlist from scratch:
 * every wire and every contact closed in the state, no precomputed static components, no observations.
 *
 * Each sample records wall time and this process's CPU time. Targets are judged on the CPU-time median, so other
 * work on a shared machine does not count against the engine; the wall-time median is printed beside it with the
 * load average.
 */
import { loadavg } from 'node:os';
import {
  createMech,
  cure,
  evaluate,
  fillMech,
  getNetlist,
  sweep,
  type Netlist,
  type Plan,
  type SimState,
} from '../../shared/engine/index';
import { isContactClosed, type Mech } from '../../shared/engine/model/nets';
import { busyState, examplePlan, largePlan, setsOnOneAdapter } from './bench-plans';

interface Row {
  name: string;
  /** CPU-time median and 95th percentile, ms per call. */
  median: number;
  p95: number;
  /** Wall-time median, ms per call. */
  wall: number;
  opsPerSecond: number;
  floor?: string;
}

const cpuMs = (since: NodeJS.CpuUsage) => {
  const d = process.cpuUsage(since);
  return (d.user + d.system) / 1000;
};

/** Times fn: warm-up runs first, then samples until both minSamples and minMs are reached. */
function measure(
  name: string,
  fn: () => unknown,
  opts: { minSamples?: number; minMs?: number; batch?: number } = {},
) {
  const batch = opts.batch ?? 1;
  const minSamples = opts.minSamples ?? 30;
  const minMs = opts.minMs ?? 1000;
  const warmUntil = performance.now() + Math.min(minMs / 2, 500);
  do fn();
  while (performance.now() < warmUntil);
  const samples: number[] = [];
  const walls: number[] = [];
  const start = performance.now();
  while (samples.length < minSamples || performance.now() - start < minMs) {
    const t = performance.now();
    const c = process.cpuUsage();
    for (let i = 0; i < batch; i++) fn();
    samples.push(cpuMs(c) / batch);
    walls.push((performance.now() - t) / batch);
    if (samples.length > 100_000) break;
  }
  const sorted = (xs: number[]) => xs.sort((a, b) => a - b);
  sorted(samples);
  const median = samples[Math.floor(samples.length / 2)];
  const p95 = samples[Math.min(samples.length - 1, Math.floor(samples.length * 0.95))];
  const wall = sorted(walls)[Math.floor(walls.length / 2)];
  const row: Row = { name, median, p95, wall, opsPerSecond: 1000 / median };
  return row;
}

/** The floor: union-find over every terminal of the netlist, from scratch, with this state's closed contacts. */
function bareUnionFind(nl: Netlist, mech: Mech, parent: Int32Array): number {
  const n = nl.terminals.length;
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (x: number) => {
    while (parent[x] !== x) x = parent[x] = parent[parent[x]];
    return x;
  };
  let unions = 0;
  for (const e of nl.edges) {
    if (e.kind === 'contact' && !isContactClosed(nl.contacts[e.contact!], mech)) continue;
    const a = find(e.a);
    const b = find(e.b);
    if (a !== b) {
      parent[a] = b;
      unions++;
    }
  }
  return unions;
}

function floorFor(plan: Plan, state: SimState) {
  const nl = getNetlist(plan);
  const mech = fillMech(nl, state, createMech(nl));
  const parent = new Int32Array(nl.terminals.length);
  return () => bareUnionFind(nl, mech, parent);
}

const ms = (x: number) => (x >= 1 ? `${x.toFixed(2)} ms` : `${(x * 1000).toFixed(1)} µs`);

function main(): void {
  const twoSet = examplePlan('demo-plan.json');
  const twoSetState = busyState(twoSet);
  const large = largePlan(10);
  const largeState = busyState(large);
  const threeSets = setsOnOneAdapter(3, 'six-key-hf');

  const twoFloor = measure('floor: bare union-find, two-set plan', floorFor(twoSet, twoSetState), {
    batch: 100,
  });
  const largeFloor = measure('floor: bare union-find, 40-set plan', floorFor(large, largeState), {
    batch: 10,
  });
  const evalTwo = measure('evaluate, two-set plan', () => evaluate(twoSet, twoSetState), { batch: 200 });
  const evalLarge = measure('evaluate, 40-set plan (10 adapters)', () => evaluate(large, largeState), {
    batch: 2,
  });
  const evalLargeNoPaths = measure(
    'evaluate, 40-set plan, paths off',
    () => evaluate(large, largeState, { paths: false }),
    { batch: 5 },
  );
  const sweepTwo = measure('exhaustive sweep, two sets', () => sweep(twoSet), { minSamples: 5, minMs: 2000 });
  const sweepThree = measure('exhaustive sweep, three sets', () => sweep(threeSets), {
    minSamples: 5,
    minMs: 3000,
  });
  const cureTwo = measure('cure, two-set plan', () => cure(twoSet), { minSamples: 5, minMs: 3000 });

  const statesThree = sweep(threeSets);
  if (statesThree.strategy !== 'exhaustive') throw new Error('the three-set sweep must be exhaustive');
  const twoCure = cure(twoSet);

  evalTwo.floor = `${(evalTwo.median / twoFloor.median).toFixed(2)}×`;
  evalLarge.floor = `${(evalLarge.median / largeFloor.median).toFixed(2)}×`;
  evalLargeNoPaths.floor = `${(evalLargeNoPaths.median / largeFloor.median).toFixed(2)}×`;
  const rows: Row[] = [
    twoFloor,
    largeFloor,
    evalTwo,
    evalLarge,
    evalLargeNoPaths,
    sweepTwo,
    sweepThree,
    cureTwo,
  ];

  const load = loadavg().map((x) => x.toFixed(2));
  console.log(
    `Leadbench engine benchmark — node ${process.version}, ${new Date().toISOString()}, load average ${load.join(' ')}`,
  );
  console.table(
    rows.map((r) => ({
      case: r.name,
      'median (cpu)': ms(r.median),
      'p95 (cpu)': ms(r.p95),
      'median (wall)': ms(r.wall),
      'ops/s': r.opsPerSecond >= 100 ? Math.round(r.opsPerSecond) : Number(r.opsPerSecond.toFixed(1)),
      'vs floor': r.floor ?? '',
    })),
  );
  console.log(
    `40-set plan: ${evaluate(large, largeState).findings.length} findings in the busy state; ` +
      `three-set sweep: ${statesThree.statesVisited} states; two-set cure: ${twoCure.changes.length} changes, ` +
      `${twoCure.searched} change sets tried, proof ${twoCure.proofOfMinimality}`,
  );

  const targets: [string, number, number][] = [
    ['40-set evaluation < 2 ms', evalLarge.median, 2],
    ['3-set exhaustive sweep < 250 ms', sweepThree.median, 250],
    ['2-set cure < 250 ms', cureTwo.median, 250],
    ['one evaluation within 5× the floor (two-set plan)', evalTwo.median / twoFloor.median, 5],
    ['40-set evaluation with paths within 5× the floor', evalLarge.median / largeFloor.median, 5],
  ];
  let missed = 0;
  for (const [label, value, limit] of targets) {
    const pass = value < limit;
    if (!pass) missed++;
    const shown = label.includes('×') ? `${value.toFixed(2)}×` : ms(value);
    console.log(`${pass ? 'PASS' : 'MISS'}  ${label}  (measured ${shown}, CPU time)`);
  }
  console.log(missed === 0 ? 'All targets met.' : `${missed} target(s) missed.`);
}

main();
