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
  it('rejects a fault nobody can see, a repair that does not cure, and a fault that does not fit', () => {
    const spec = shipped('dark-lamp-front-desk');
    const invisible = checkPuzzle({
      ...spec,
      faults: [{ kind: 'lead-wrongly-lifted', part: 'front-desk', pair: 17, conductor: 'both' }],
    });
    expect(invisible.ok).toBe(false);
    expect(invisible.problems.join(' ')).toMatch(/no symptom/);

    const noCure = checkPuzzle({ ...spec, repair: [{ kind: 'restore', part: 'drawing-room', pair: 3 }] });
    expect(noCure.problems.join(' ')).toMatch(/does not clear fault 1/);

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
