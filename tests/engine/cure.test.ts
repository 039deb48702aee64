import { describe, expect, it } from 'vitest';
import { applyCure, checkRequired, cure, sweep, type CureResult, type Plan } from '../../shared/engine/index';
import { examplePlan } from '../support/example-plans';
import { planBuilder } from '../support/plan-builder';
import { withAddOnForEverySet } from './cure-plans';

const example = examplePlan;

const lifts = (r: CureResult) => r.changes.filter((c) => c.change.kind === 'lift');
const moves = (r: CureResult) => r.changes.filter((c) => c.change.kind === 'move');
const liftedPairs = (r: CureResult) =>
  lifts(r)
    .map((c) => c.change.pair)
    .sort((a, b) => a - b);

function expectCured(plan: Plan, result: CureResult): Plan {
  expect(result.ok, result.message).toBe(true);
  const cured = applyCure(plan, result);
  const after = sweep(cured);
  expect(after.findings.map((f) => f.finding.message)).toEqual([]);
  expect(checkRequired(cured)).toEqual([]);
  return cured;
}

describe('cure of the two-set hands-free plan with a shared buzzer pair (demo plan)', () => {
  const plan = example('demo-plan.json');
  const result = cure(plan);

  it('takes four changes: the last three pairs of one set and one buzzer moved to the spare pair', () => {
    // Trade facts 7 and 8: common practice, no published source.
    expect(result.changes).toHaveLength(4);
    expect(result.proofOfMinimality).toBe('exhaustive');
    expect(liftedPairs(result)).toEqual([23, 24, 25]);
    expect(new Set(lifts(result).map((c) => c.part)).size).toBe(1);
    const [move] = moves(result);
    // Pair 18 (yellow-green) to pair 17 (yellow-orange), ICEA S-80-576 colour code; the pair plan is our own.
    expect(move.change).toEqual({ kind: 'move', pair: 18, toPair: 17 });
    expect(move.crossConnect).toMatchObject({ port: 1, pair: 17, lead: { kind: 'buzzer' } });
    expect(move.cost).toMatch(/^none: spare pair 17/);
  });

  it('never lifts in the set whose hands-free add-on must keep working', () => {
    expect(plan.required.handsFreeSets).toEqual(['front-counter']);
    expect(lifts(result).every((c) => c.part === 'workroom')).toBe(true);
    expect(lifts(result)[0].cost).toBe('none: Workroom has no hands-free add-on (it can no longer take one)');
  });

  it('leaves a plan whose sweep is clean and whose required functions all work', () => {
    expect(result.before.length).toBeGreaterThan(0);
    const cured = expectCured(plan, result);
    expect(cured).not.toBe(plan);
    expect(plan.sets.every((s) => s.leadChanges.length === 0)).toBe(true);
  });

  it('no cure of three changes exists', () => {
    const smaller = cure(plan, { maxChanges: 3 });
    expect(smaller.ok).toBe(false);
    expect(smaller.changes).toEqual([]);
  });

  it('still prefers the set without an add-on when no hands-free is required', () => {
    const free = { ...plan, required: { ...plan.required, handsFreeSets: [] } };
    const r = cure(free);
    expect(r.changes).toHaveLength(4);
    expect(lifts(r).every((c) => c.part === 'workroom')).toBe(true);
  });
});

describe('cure of the other example plans', () => {
  it('two hands-free sets answering one station: three lifted pairs in one set', () => {
    const plan = example('two-set.json');
    const result = cure(plan);
    // Common practice, no published source.
    expect(result.changes).toHaveLength(3);
    expect(liftedPairs(result)).toEqual([23, 24, 25]);
    expect(new Set(result.changes.map((c) => c.part)).size).toBe(1);
    expectCured(plan, result);
  });

  it('six-key with hands-free wiring beside a ten-key set: the last three pairs of the six-key set', () => {
    const plan = example('six-and-ten.json');
    const result = cure(plan);
    // Common practice, no published source.
    expect(result.changes.map((c) => c.part)).toEqual(['desk', 'desk', 'desk']);
    expect(liftedPairs(result)).toEqual([23, 24, 25]);
    expectCured(plan, result);
  });

  it('two stations on one buzzer pair: one buzzer moved, with its station following it at the KSU', () => {
    const plan = example('intercom.json');
    const result = cure(plan);
    // Common practice, no published source.
    expect(result.changes).toHaveLength(1);
    const [move] = result.changes;
    expect(move.change).toEqual({ kind: 'move', pair: 18, toPair: 17 });
    expect(move.replaces).toMatchObject({ port: 1, pair: 18, lead: { kind: 'buzzer' } });
    expectCured(plan, result);
  });

  it('three hands-free sets on one adapter: the last three pairs of two of them', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 1 });
    const ad = b.adapter('bridging-adapter-4');
    b.cable(ksu.port(1), ad.plug);
    for (const name of ['Till', 'Office', 'Stores']) {
      b.cable(
        ad.jack(b.input().sets!.length + 1),
        b.set('six-key-hf', name, { station: ksu.stations[0] }).cord,
      );
    }
    const plan = b.build();
    const result = cure(plan);
    // Any two of three paralleled hands-free sets still share pairs 23–25: common practice,
    // no published source.
    expect(result.changes).toHaveLength(6);
    expect(result.proofOfMinimality).toBe('exhaustive');
    expect(new Set(result.changes.map((c) => c.part)).size).toBe(2);
    expect(liftedPairs(result)).toEqual([23, 23, 24, 24, 25, 25]);
    expectCured(plan, result);
  }, 30_000);

  it('a clean plan needs nothing', () => {
    // One set alone on its cable, with no more lines than keys: common practice, no published source.
    const b = planBuilder();
    const ksu = b.ksu({ lines: 3, stations: 1 });
    b.cable(ksu.port(1), b.set('six-key', 'Alone', { station: ksu.stations[0] }).cord);
    const result = cure(b.build());
    expect(result).toMatchObject({ ok: true, changes: [], proofOfMinimality: 'exhaustive' });
  });

  it('names what a lift costs when every set has a hands-free add-on', () => {
    const plan = example('two-set.json');
    const withAddOns = withAddOnForEverySet(plan);
    const result = cure(withAddOns);
    expect(result.changes).toHaveLength(3);
    const name = withAddOns.sets.find((s) => s.id === result.changes[0].part)!.name;
    expect(result.changes.every((c) => c.cost === `${name} loses its hands-free connection`)).toBe(true);
  });

  it('says so when no lead change can keep what is required', () => {
    // Both sets must keep hands-free, so neither may lose its last three pairs: no cure exists.
    const plan = example('two-set.json');
    const strict = { ...plan, required: { ...plan.required, handsFreeSets: plan.sets.map((s) => s.id) } };
    const withAddOns = withAddOnForEverySet(strict);
    const result = cure(withAddOns, { maxChanges: 2 });
    expect(result.ok).toBe(false);
    expect(result.message).toMatch(/No cure/);
  });
});
