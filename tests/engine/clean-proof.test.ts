/**
 * The clean proof against the exhaustive sweep: whenever proveClean says a plan is clean, the exhaustive sweep (every
 * combination of set positions with every KSU event) shows no finding of a state rule. The coarse nets it rests on
 * are checked against the nets of random states directly.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  applyCure,
  computeNets,
  cureOptimal,
  evaluate,
  eventActions,
  getNetlist,
  initialState,
  planSoundSweep,
  planSweep,
  proveClean,
  setMoves,
  sweep,
  sweepEvents,
  type Finding,
  type Plan,
} from '../../shared/engine/index';
import { buildCoarseNets } from '../../shared/engine/model/coarse-nets';
import { coarsePositions } from '../../shared/engine/search/clean-proof';
import { RULES } from '../../shared/engine/observe/rules/index';
import { operate } from '../support/plan-builder';
import { buildPlan, planSpec, propertySeed } from '../support/random-plans';
import { largePlan, setsOnOneAdapter } from '../bench/bench-plans';

const stateFindings = (findings: readonly Finding[]) =>
  findings.filter((f) => RULES[f.code].kind === 'state');

/** Largest exhaustive sweep the property runs; a larger random plan is checked against the default sweep. */
const REFERENCE_STATES = 100_000;
/** Largest default sweep the property runs as the reference; a larger random plan is left out (minutes each). */
const DEFAULT_REFERENCE_STATES = 400_000;

/**
 * Whether the plan's sweep shows no state rule's finding: the exhaustive sweep (every combination of set positions
 * with every KSU event), or for the larger random plans the default sweep, which tests/engine/sweep-soundness.test.ts
 * checks against the exhaustive one; null when even that is too long for a test.
 */
function referenceClean(plan: Plan): boolean | null {
  const exhaustive = planSweep(plan, { strategy: 'exhaustive' }).total <= REFERENCE_STATES;
  if (!exhaustive && planSoundSweep(plan).total > DEFAULT_REFERENCE_STATES) return null;
  const reference = sweep(plan, exhaustive ? { strategy: 'exhaustive' } : {});
  expect(reference.complete).toBe(true);
  return stateFindings(reference.findings.map((f) => f.finding)).length === 0;
}

describe('proveClean on random plans', () => {
  it('is never proven where the exhaustive sweep finds a state finding, and is proven on most cured plans', async () => {
    const seed = propertySeed('clean proof');
    const tally = { plans: 0, proven: 0, cleanByReference: 0 };
    const check = (plan: Plan) => {
      const clean = referenceClean(plan);
      if (clean === null) return;
      const proof = proveClean(plan);
      tally.plans++;
      if (clean) tally.cleanByReference++;
      if (proof.proven) {
        tally.proven++;
        expect(clean, proof.words).toBe(true);
      }
    };
    await fc.assert(
      fc.asyncProperty(planSpec, async (spec) => {
        const plan = buildPlan(spec);
        check(plan);
        // A few rounds of the cure are enough for most random plans; one that needs more is left uncured.
        const cured = await cureOptimal(plan, { maxRounds: 4 });
        if (!cured.ok || cured.changes.length === 0) return;
        check(applyCure(plan, cured));
        // One change short of the cure: usually a fault is back, and the proof must not miss it.
        check(applyCure(plan, { changes: cured.changes.slice(1) }));
      }),
      { seed, numRuns: 12 },
    );
    console.log(
      `clean proof: ${tally.proven} proven of ${tally.plans} plans, ${tally.cleanByReference} clean`,
    );
    // Not vacuous: the proof speaks for a good share of the plans that are clean (the cured ones at least).
    expect(tally.proven).toBeGreaterThanOrEqual(Math.ceil(tally.cleanByReference / 2));
    expect(tally.proven).toBeGreaterThan(0);
  }, 600_000);

  it('puts every two terminals on one net of a state on one coarse net', () => {
    fc.assert(
      fc.property(planSpec, fc.array(fc.nat(), { minLength: 4, maxLength: 4 }), (spec, picks) => {
        const plan = buildPlan(spec);
        const nl = getNetlist(plan);
        const moves = plan.sets.map((_, i) => setMoves(plan, i));
        const coarse = buildCoarseNets(nl, coarsePositions(plan));
        const at = moves.map((ms, i) => picks[i] % ms.length);
        const state = initialState(plan);
        plan.sets.forEach((s, i) => {
          const m = moves[i][at[i]];
          state.sets[s.id] = {
            ...state.sets[s.id],
            offHook: m.offHook,
            pressedKey: m.key,
            handsFreeOn: m.handsFree,
          };
        });
        const { facts } = computeNets(plan, state);
        // Per net of the state: the coarse net of its first component; every other component must agree.
        const coarseOfNet = new Map<number, number>();
        for (let d = 0; d < nl.denseCount; d++) {
          const owner = coarse.ownerOf[d];
          const c = coarse.root[coarse.vertex(d, owner < 0 ? 0 : at[owner])];
          const net = facts.roots[d];
          const known = coarseOfNet.get(net);
          if (known === undefined) coarseOfNet.set(net, c);
          else expect(c).toBe(known);
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('proveClean, fixed cases', () => {
  it('proves the cured 40-set layout clean, and not the layout before the cure', async () => {
    const plan = largePlan(10);
    expect(plan.sets).toHaveLength(40);
    const before = proveClean(plan);
    expect(before.proven).toBe(false);
    const cured = await cureOptimal(plan);
    expect(cured.ok).toBe(true);
    expect(cured.verifiedBy).toBe('complete-sweep');
    const fixed = applyCure(plan, cured);
    const proof = proveClean(fixed);
    expect(proof.proven).toBe(true);
    const result = sweep(fixed);
    expect(result.complete).toBe(true);
    expect(result.cleanProof).toMatch(/proof/);
    expect(stateFindings(result.findings.map((f) => f.finding))).toEqual([]);

    // Independent spot check: random states of the cured layout (positions × every event) show no state finding.
    const events = sweepEvents(fixed);
    const moves = fixed.sets.map((_, i) => setMoves(fixed, i));
    fc.assert(
      fc.property(
        fc.array(fc.nat(), { minLength: 40, maxLength: 40 }),
        fc.nat({ max: events.length - 1 }),
        (picks, e) => {
          // The sets' positions set over the event's opening state, as the sweep visits them.
          const state = operate(fixed, eventActions(fixed, events[e]));
          fixed.sets.forEach((s, i) => {
            const m = moves[i][picks[i] % moves[i].length];
            state.sets[s.id] = {
              ...state.sets[s.id],
              offHook: m.offHook,
              pressedKey: m.key,
              handsFreeOn: m.handsFree,
            };
          });
          expect(stateFindings(evaluate(fixed, state, { paths: false }).findings)).toEqual([]);
        },
      ),
      { numRuns: 40 },
    );
  }, 120_000);

  it('never proves a plan with a known fault', () => {
    const plan = setsOnOneAdapter(4, 'six-key-hf');
    // Two hands-free sets on one cable with different line keys down join their lines through the hands-free
    // leads they share: common practice, no published source.
    const result = sweep(plan);
    expect(result.complete).toBe(true);
    expect(result.findings.map((f) => f.finding)).toHaveFinding('LINES_JOINED');
    const proof = proveClean(plan);
    expect(proof.proven).toBe(false);
    if (!proof.proven) expect(proof.reason).toMatch(/Lines joined/);
  });
});
