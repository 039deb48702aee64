/**
 * The puzzle checker and grader, on the shipped puzzles and on hand-made broken ones. Trade facts: a lamp whose
 * lamp lead is lifted stays dark; two sets whose common talk pairs are paralleled hear each other's lines
 * (common practice, no published source). The pair colours follow ICEA S-80-576.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import {
  SHIPPED_PUZZLES,
  applyRepair,
  checkPuzzle,
  differingProbes,
  explainPuzzle,
  gradeSubmission,
  plantFaults,
  probeState,
  probes,
  sightingOf,
  undoingRepair,
  type PuzzleSpec,
} from '../../shared/training/index';

const shipped = (slug: string): PuzzleSpec => {
  const { slug: _slug, ...spec } = SHIPPED_PUZZLES.find((p) => p.slug === slug)!;
  return spec;
};
const context = { attemptNumber: 1, statesTried: 5, elapsedMs: 5 * 60_000 };

describe('shipped puzzles', () => {
  it('number at least twelve, in all three levels, with unique slugs', () => {
    expect(SHIPPED_PUZZLES.length).toBeGreaterThanOrEqual(12);
    expect(new Set(SHIPPED_PUZZLES.map((p) => p.level))).toEqual(new Set([1, 2, 3]));
    expect(new Set(SHIPPED_PUZZLES.map((p) => p.slug)).size).toBe(SHIPPED_PUZZLES.length);
  });

  it.each(SHIPPED_PUZZLES.map((p) => [p.slug, p] as const))('%s passes the check', (_slug, puzzle) => {
    expect(checkPuzzle(puzzle)).toMatchObject({ ok: true, problems: [] });
  });
});

describe('sightings', () => {
  it('show the lifted lamp lead as a dark lamp where the healthy plan lights it', () => {
    const spec = shipped('dark-lamp-front-desk');
    const faulty = plantFaults(spec.plan, spec.faults);
    if (!faulty.ok) throw new Error(faulty.problem);
    const probe = probes(spec.plan).find((p) => p.name === 'drawing-room key 1')!;
    const lamp = (plan: typeof spec.plan) =>
      sightingOf(plan, probeState(plan, probe)!).sets.find((s) => s.set === 'front-desk')!.keys[0].lamp;
    expect(lamp(spec.plan)).toBe('steady');
    expect(lamp(faulty.plan)).toBe('dark');
  });

  it('hear two dial tones when the common talk pairs are paralleled', () => {
    const spec = shipped('two-dial-tones');
    const faulty = plantFaults(spec.plan, spec.faults);
    if (!faulty.ok) throw new Error(faulty.problem);
    const probe = probes(spec.plan).find((p) => p.name === 'reception and back-office on two lines')!;
    const tones = sightingOf(faulty.plan, probeState(faulty.plan, probe)!).sets.map((s) => s.tones);
    expect(tones).toEqual([['dial', 'dial'], ['dial', 'dial']]);
    expect(differingProbes(spec.plan, faulty.plan)).toContain(probe.name);
  });
});

describe('the checker', () => {
  it('rejects a fault nobody can see, a repair that does not cure, a repair step given twice, and a fault that does not fit', () => {
    const spec = shipped('dark-lamp-front-desk');
    const invisible = checkPuzzle({
      ...spec,
      faults: [{ kind: 'lead-wrongly-lifted', part: 'front-desk', pair: 17, conductor: 'both' }],
    });
    expect(invisible.ok).toBe(false);
    expect(invisible.problems.join(' ')).toMatch(/no symptom/);

    const noCure = checkPuzzle({ ...spec, repair: [{ kind: 'restore', part: 'drawing-room', pair: 3 }] });
    expect(noCure.problems.join(' ')).toMatch(/does not clear fault 1/);

    const step = spec.repair[0]!;
    const repeated = checkPuzzle({ ...spec, repair: [...spec.repair, { ...step }] });
    expect(repeated.problems).toContain('The intended repair lists step 1 twice');

    const unfit = checkPuzzle({ ...spec, faults: [{ kind: 'lead-left-on', part: 'front-desk', pair: 3 }] });
    expect(unfit.problems.join(' ')).toMatch(/no lifted lead on pair 3/);
  });
});

describe('grading', () => {
  it('gives full marks to the intended repair with the right diagnosis on the first attempt', () => {
    const spec = shipped('back-office-two-faults');
    const graded = gradeSubmission(
      spec,
      {
        diagnoses: [
          { part: 'back-office', pair: 23, conductor: null, kind: 'lead-left-on' },
          { part: 'ksu', pair: 17, conductor: null, kind: 'cross-connect-wrong' },
        ],
        repair: spec.repair,
      },
      context,
    );
    if (!graded.ok) throw new Error(graded.problem);
    expect(graded.result).toMatchObject({ passed: true, score: 100, faultsCleared: 2, diagnosesRight: 2, unnecessaryChanges: 0 });
  });

  it('credits one of two faults, counts an unnecessary change, and takes off for extra attempts and time', () => {
    const spec = shipped('back-office-two-faults');
    const graded = gradeSubmission(
      spec,
      {
        diagnoses: [{ part: 'back-office', pair: 23, conductor: null, kind: 'lead-left-on' }],
        repair: [
          spec.repair[0],
          // Line 3's lamp pair is 9 (pair 3k for line k, templates/README.md): lifting it is not needed and harms.
          { kind: 'lead', part: 'reception', change: { kind: 'lift', pair: 9, conductor: 'tip' } },
        ],
      },
      { attemptNumber: 2, statesTried: 1, elapsedMs: 30 * 60_000 },
    );
    if (!graded.ok) throw new Error(graded.problem);
    const points = Object.fromEntries(graded.result.breakdown.map((l) => [l.item, l.points]));
    expect(graded.result.passed).toBe(false);
    expect(graded.result.faultsCleared).toBe(1);
    expect(graded.result.unnecessaryChanges).toBe(1);
    expect(points).toMatchObject({ cleared: 20, required: 0, economy: 5, attempts: -10, time: -10 });
  });

  it('says so when a repair step does not fit the installation', () => {
    const graded = gradeSubmission(shipped('silent-line-two'), { diagnoses: [], repair: [{ kind: 'restore', part: 'nobody', pair: 1 }] }, context);
    expect(graded).toEqual({ ok: false, problem: 'Step 1: No set or add-on "nobody"' });
  });

  it('explains with the finding path where the engine reports one', () => {
    const explanation = explainPuzzle(shipped('two-dial-tones'));
    expect(explanation.paths[0].hops.length).toBeGreaterThan(1);
    expect(explanation.repair).toEqual(['Back office: lift pair 23 (both leads)']);
  });

  it('leaves the healthy plan untouched when planting and repairing', () => {
    const spec = shipped('boatyard-two-faults');
    const before = JSON.stringify(spec.plan);
    const faulty = plantFaults(spec.plan, spec.faults);
    if (faulty.ok) applyRepair(faulty.plan, spec.repair);
    expect(JSON.stringify(spec.plan)).toBe(before);
  });
});

describe('npm run puzzles -- --check', () => {
  it('prints the count, the levels and no failures, and exits 0', () => {
    const out = execFileSync('npx', ['tsx', 'server/cli/puzzles.ts', '--check'], { encoding: 'utf8' });
    const report = JSON.parse(out) as { count: number; levels: Record<string, number>; failures: unknown[] };
    expect(report.count).toBe(SHIPPED_PUZZLES.length);
    expect(Object.values(report.levels).reduce((a, b) => a + b, 0)).toBe(report.count);
    expect(report.failures).toEqual([]);
  }, 60_000);

  it('exits 2 without --check', () => {
    expect(spawnSync('npx', ['tsx', 'server/cli/puzzles.ts'], { encoding: 'utf8' }).status).toBe(2);
  }, 60_000);
});

describe('the repair that undoes the faults (the puzzle maker’s starting point)', () => {
  it.each(SHIPPED_PUZZLES.map((p) => [p.slug, p] as const))('cures %s', (_slug, puzzle) => {
    expect(checkPuzzle({ ...puzzle, repair: undoingRepair(puzzle.plan, puzzle.faults) }).problems).toEqual([]);
  });
});

describe('wiring faults in a cable (split pair, reversed pair, open conductor)', () => {
  /** The faulty plan of a shipped puzzle and a set's sighting in one of its probes. */
  function seen(slug: string, probeName: string, set: string, faultyPlan = true) {
    const spec = shipped(slug);
    const planted = plantFaults(spec.plan, spec.faults);
    if (!planted.ok) throw new Error(planted.problem);
    const plan = faultyPlan ? planted.plan : spec.plan;
    const probe = probes(spec.plan).find((p) => p.name === probeName)!;
    return sightingOf(plan, probeState(plan, probe)!).sets.find((s) => s.set === set)!;
  }

  it.each([
    ['drawing-room-never-buzzes', 'drawing-cord', [{ kind: 'open-conductor', pair: 18, conductor: 'ring', end: 'to' }]],
    ['counter-lamp-line-one', 'counter-cord', [{ kind: 'reversed-pair', pair: 3, end: 'from' }]],
    ['front-desk-split-pair', 'front-cord', [{ kind: 'split-pair', pair: 1, withPair: 4, conductor: 'tip', end: 'from' }]],
  ])('%s plants its fault on the cable, and the intended repair takes it off again', (slug, cable, faults) => {
    const spec = shipped(slug);
    const planted = plantFaults(spec.plan, spec.faults);
    if (!planted.ok) throw new Error(planted.problem);
    expect(planted.plan.cables.find((c) => c.id === cable)!.faults).toEqual(faults);
    expect(spec.plan.cables.find((c) => c.id === cable)!.faults).toBeUndefined();
    const repaired = applyRepair(planted.plan, spec.repair);
    if (!repaired.ok) throw new Error(repaired.problem);
    expect(repaired.plan).toEqual(spec.plan);
    expect(differingProbes(spec.plan, repaired.plan)).toEqual([]);
  });

  it('open conductor: the buzzer on the broken pair is silent (common practice, no published source)', () => {
    expect(seen('drawing-room-never-buzzes', 'call 22', 'drawing-room', false).buzzer).toBe(true);
    expect(seen('drawing-room-never-buzzes', 'call 22', 'drawing-room').buzzer).toBe(false);
    expect(seen('drawing-room-never-buzzes', 'drawing-room key 1', 'drawing-room').tones).toEqual(['dial']);
  });

  it('reversed lamp pair: line 1 stays dark on both sets while talk works (common practice, no published source)', () => {
    const counter = seen('counter-lamp-line-one', 'counter key 1', 'counter');
    expect(counter.keys[0].lamp).toBe('dark');
    expect(counter.tones).toEqual(['dial']);
    expect(seen('counter-lamp-line-one', 'counter key 1', 'bakehouse').keys[0].lamp).toBe('dark');
    expect(seen('counter-lamp-line-one', 'counter key 1', 'counter', false).keys[0].lamp).toBe('steady');
  });

  it('split pair: no dial tone at the front desk on lines 1 and 2, lamps still lit (common practice, no published source)', () => {
    for (const key of [1, 2]) {
      const front = seen('front-desk-split-pair', `front-desk key ${key}`, 'front-desk');
      expect(front.tones).toEqual([]);
      expect(front.keys[key - 1].lamp).toBe('steady');
      expect(seen('front-desk-split-pair', `front-desk key ${key}`, 'front-desk', false).tones).toEqual(['dial']);
    }
    expect(seen('front-desk-split-pair', 'drawing-room key 1', 'drawing-room').tones).toEqual(['dial']);
  });

  it('grades a right diagnosis naming the set on that cable and the pair', () => {
    const spec = shipped('front-desk-split-pair');
    const graded = gradeSubmission(
      spec,
      { diagnoses: [{ part: 'front-desk', pair: 1, conductor: null, kind: 'split-pair' }], repair: spec.repair },
      context,
    );
    if (!graded.ok) throw new Error(graded.problem);
    expect(graded.result).toMatchObject({ passed: true, faultsCleared: 1, diagnosesRight: 1 });
    expect(explainPuzzle(spec).repair).toEqual([
      'The cable from Front desk to Key service unit: re-terminate pair 1 at both ends',
    ]);
  });

  it('refuses a wiring fault on a cable the plan does not have, or a split onto the same pair', () => {
    const spec = shipped('front-desk-split-pair');
    expect(plantFaults(spec.plan, [{ kind: 'reversed-pair', cable: 'nowhere', pair: 1, end: 'to' }])).toEqual({
      ok: false,
      problem: 'Fault 1: No cable "nowhere" in the plan',
    });
    const same = plantFaults(spec.plan, [
      { kind: 'split-pair', cable: 'front-cord', pair: 4, withPair: 4, conductor: 'ring', end: 'to' },
    ]);
    expect(same).toMatchObject({ ok: false });
    expect(!same.ok && same.problem).toContain('A split pair needs two different pairs');
  });
});
