/** The cure as an integer program: the same answers as the breadth-first search where that search can answer, and
 * answers where it cannot (the 40-set layout needs far more than eight changes). */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { applyCure, checkRequired, cure, cureOptimal, sweep, type Plan } from '../../shared/engine/index';
import highsLoader, { type LegacyHighs } from 'highs';
import { largePlan, setsOnOneAdapter } from '../bench/bench-plans';
import { examplePlan } from '../support/example-plans';
import { buildPlan, planSpec, propertySeed } from '../support/random-plans';
import { withAddOnForEverySet } from './cure-plans';

async function expectCleanCure(plan: Plan) {
  const result = await cureOptimal(plan);
  expect(result.ok, result.message).toBe(true);
  const cured = applyCure(plan, result);
  expect(sweep(cured).findings.map((f) => f.finding.message)).toEqual([]);
  expect(checkRequired(cured)).toEqual([]);
  return result;
}

describe('cure by integer programming', () => {
  it.each(['demo-plan.json', 'two-set.json', 'six-and-ten.json', 'intercom.json'])(
    'takes as few changes as the breadth-first search on %s',
    async (file) => {
      const plan = examplePlan(file);
      const bySearch = cure(plan);
      const result = await expectCleanCure(plan);
      // The breadth-first search proves its answer minimal on these plans (proof 'exhaustive').
      expect(bySearch.proofOfMinimality).toBe('exhaustive');
      expect(result.changes).toHaveLength(bySearch.changes.length);
      expect(result.proofOfMinimality).toBe('exhaustive');
    },
    60_000,
  );

  it('cures the 40-set layout, lifting pairs 23–25 in every hands-free wired set and add-on', async () => {
    const plan = largePlan(10);
    // Beyond the breadth-first search's reach (at most eight changes).
    expect(cure(plan, { budget: 200 }).ok).toBe(false);
    const result = await expectCleanCure(plan);
    // 20 hands-free wired sets and 10 add-ons share pairs 23–25 with the ten-key sets' lines 6–9 and the KSU's
    // station plan (templates/README.md, our own pair scheme): three lifts each. Arithmetic over the layout.
    expect(result.changes).toHaveLength(30 * 3);
    expect(new Set(result.changes.map((c) => c.change.pair))).toEqual(new Set([23, 24, 25]));
    // The covers seeded from the wiring findings hold all three pairs of every shared private lead, and the only
    // cure of that weight is this one, so the first changed plan already sweeps clean (README, seeding).
    expect(result.rounds).toBe(1);
  }, 120_000);

  it('names the finding it cannot clear when every set must keep its hands-free', async () => {
    const plan = examplePlan('two-set.json');
    const strict = withAddOnForEverySet(plan);
    const result = await cureOptimal(strict, { keepAddOn: plan.sets.map((s) => s.id) });
    expect(result.ok).toBe(false);
    expect(result.blocking?.reason).toMatch(/no change/);
    expect(result.message).toMatch(/^No cure: /);
  });

  it('reports what keeping a set untouched costs', async () => {
    const plan = examplePlan('two-set.json');
    const free = await cureOptimal(plan);
    const lifted = free.changes[0].part;
    const result = await cureOptimal(plan, { untouched: [lifted] });
    expect(result.ok).toBe(true);
    expect(result.changes.every((c) => c.part !== lifted)).toBe(true);
    expect(result.choices).toEqual([
      expect.objectContaining({ set: lifted, option: 'untouched', extraChanges: 0 }),
    ]);
  }, 60_000);

  it('finds the cheapest cure of the fewest changes whichever route the solver takes to it', async () => {
    // Four hands-free wired sets on one adapter: cures of ten changes that differ only in cost rank (buzzer moves
    // against lifts). The solver's heuristics change the order it meets them in; the optimum must not change.
    const plan = setsOnOneAdapter(4);
    const highs = await highsLoader();
    const withoutHeuristics = (): Promise<LegacyHighs> =>
      Promise.resolve({
        ...highs,
        solve: (problem: string, options?: Parameters<LegacyHighs['solve']>[1]) =>
          highs.solve(problem, { ...options, mip_heuristic_run_feasibility_jump: false } as Parameters<
            LegacyHighs['solve']
          >[1]),
      });
    const usual = await cureOptimal(plan);
    const other = await cureOptimal(plan, { loadSolver: withoutHeuristics });
    expect(usual.ok && other.ok).toBe(true);
    expect(other.changes).toHaveLength(usual.changes.length);
    expect(other.weight).toBeCloseTo(usual.weight, 6);
  }, 120_000);

  it('takes as few changes as the breadth-first search on random plans of two and three sets', async () => {
    // The breadth-first search tries every set of changes by size, so where it answers within its budget its answer
    // is the smallest by construction: an independent reference for the solver's proof of minimality.
    const seed = propertySeed('cure against the breadth-first search', 5);
    const tally = { compared: 0 };
    await fc.assert(
      fc.asyncProperty(
        planSpec.filter((s) => s.sets.length <= 3),
        async (spec) => {
          const plan = buildPlan(spec);
          const bySearch = cure(plan, { budget: 20_000 });
          if (!bySearch.ok || bySearch.proofOfMinimality !== 'exhaustive') return;
          const result = await cureOptimal(plan);
          expect(result.ok, result.message).toBe(true);
          expect(result.changes, JSON.stringify(spec)).toHaveLength(bySearch.changes.length);
          expect(sweep(applyCure(plan, result)).findings).toEqual([]);
          tally.compared++;
        },
      ),
      { seed, numRuns: 12 },
    );
    // The seed is chosen so that several plans have a cure to compare (most random plans cannot keep every
    // required function and have none).
    expect(tally.compared).toBeGreaterThanOrEqual(2);
  }, 240_000);
});
