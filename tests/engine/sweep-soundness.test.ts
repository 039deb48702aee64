/**
 * The default sweep against the exhaustive one: the same distinct findings (code + sets + lines + stations), each at
 * the same smallest state size. The exhaustive sweep is the reference: it operates every combination of set
 * positions with every KSU event.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  evaluate,
  findingKey,
  interchangeableSets,
  standardCrossConnect,
  sweep,
  type LeadChange,
  type Plan,
  type SweepResult,
} from '../../shared/engine/index';
import { operate, planBuilder } from '../support/plan-builder';

/** Each distinct finding with the size of its smallest state. */
const found = (r: SweepResult) => r.findings.map((f) => `${findingKey(f.finding)} @${f.stateSize}`).sort();

function expectSameAsExhaustive(plan: Plan): SweepResult {
  const fast = sweep(plan);
  const reference = sweep(plan, { strategy: 'exhaustive' });
  expect(reference.complete).toBe(true);
  expect(fast.complete, fast.incompleteReason).toBe(true);
  expect(found(fast)).toEqual(found(reference));
  return fast;
}

describe('fixed cases', () => {
  it('two hands-free wired sets on different ports of a nine-line KSU', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 9, stations: 2, ports: 2 });
    b.cable(ksu.port(1), b.set('six-key-hf', 'Front', { station: ksu.stations[0] }).cord);
    b.cable(ksu.port(2), b.set('six-key-hf', 'Back', { station: ksu.stations[1] }).cord);
    const plan = b.build();
    const result = expectSameAsExhaustive(plan);
    // The standard station plan carries lines 6–9 on pairs 22–25 of every port (templates/README.md, our own
    // scheme), so the two sets' pair-23 talk commons meet on line 7's A-lead: common practice, no published source.
    expect(result.findings.map((f) => f.finding)).toHaveFinding('LINES_JOINED');
    expect(result.findings.some((f) => f.finding.sets.length === 2)).toBe(true);
  });

  it('four sets on one port', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 2 });
    const ad = b.adapter('bridging-adapter-4');
    b.cable(ksu.port(1), ad.plug);
    for (let i = 1; i <= 4; i++) b.cable(ad.jack(i), b.set('six-key-hf', `Set ${i}`).cord);
    const plan = b.build();
    // The four sets are the same part on the same nets: one group of interchangeable sets.
    expect(interchangeableSets(plan)).toEqual([[0, 1, 2, 3]]);
    const result = expectSameAsExhaustive(plan);
    expect(result.statesVisited).toBeLessThan(sweep(plan, { strategy: 'exhaustive' }).statesVisited);
    // Every kept state reproduces its finding when replayed through the actions.
    for (const f of result.findings) {
      const state = operate(plan, f.actions);
      expect(evaluate(plan, state).findings.map(findingKey)).toContain(findingKey(f.finding));
    }
  }, 60_000);

  it('two sets on each of two ports', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 2 });
    for (const port of [1, 2]) {
      const ad = b.adapter('bridging-adapter', `Adapter ${port}`);
      b.cable(ksu.port(port), ad.plug);
      for (const j of [1, 2])
        b.cable(ad.jack(j), b.set('six-key-hf', `Set ${port}${j}`, { station: ksu.stations[port - 1] }).cord);
    }
    const plan = b.build();
    expect(interchangeableSets(plan)).toEqual([
      [0, 1],
      [2, 3],
    ]);
    expectSameAsExhaustive(plan);
  }, 60_000);

  it('a plan too large for a complete sweep says so', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 9, stations: 2, ports: 6 });
    ['six-key', 'six-key-hf', 'ten-key', 'six-key', 'ten-key', 'single-line'].forEach((t, i) =>
      b.cable(ksu.port(i + 1), b.set(t, `Set ${i + 1}`).cord),
    );
    const result = sweep(b.build(), { limit: 2000 });
    expect(result.complete).toBe(false);
    expect(result.incompleteReason).toMatch(/Too large/);
  });
});

// ---------------------------------------------------------------------------------------------------------------
// Random plans

const SET_TEMPLATES = ['six-key', 'six-key-hf', 'ten-key', 'single-line'] as const;

interface SetSpec {
  template: (typeof SET_TEMPLATES)[number];
  addOn: boolean;
  /** Index of the station port, or of an adapter (ports first, then adapters). */
  where: number;
  station: boolean;
  leadChanges: LeadChange[];
}

const leadChange: fc.Arbitrary<LeadChange> = fc.oneof(
  fc.record({
    kind: fc.constant('lift' as const),
    pair: fc.integer({ min: 1, max: 25 }),
    conductor: fc.constantFrom('tip' as const, 'ring' as const, 'both' as const),
  }),
  fc.record({
    kind: fc.constant('move' as const),
    pair: fc.integer({ min: 1, max: 25 }),
    toPair: fc.integer({ min: 1, max: 25 }),
  }),
);

const setSpec: fc.Arbitrary<SetSpec> = fc.record({
  template: fc.constantFrom(...SET_TEMPLATES),
  addOn: fc.boolean(),
  where: fc.integer({ min: 0, max: 2 }),
  station: fc.boolean(),
  leadChanges: fc.array(leadChange, { maxLength: 2 }),
});

const planSpec = fc.record({
  lines: fc.constantFrom(5, 9),
  sets: fc.array(setSpec, { minLength: 2, maxLength: 4 }),
  // Identical sets on one adapter are common: copy the first set's spec onto some of the others.
  copies: fc.array(fc.boolean(), { minLength: 3, maxLength: 3 }),
  customCrossConnect: fc.option(
    fc.record({
      port: fc.constantFrom(1, 2),
      pair: fc.integer({ min: 16, max: 25 }),
      line: fc.integer({ min: 1, max: 5 }),
    }),
  ),
});

/** Many add-ons make the exhaustive reference slow: at most two add-ons, one when there are four sets. */
type PlanSpec = typeof planSpec extends fc.Arbitrary<infer T> ? T : never;

function buildPlan(spec: PlanSpec): Plan {
  const b = planBuilder('Random plan');
  const ports = 2;
  const ksu = b.ksu({ lines: spec.lines, stations: 2, ports });
  const sets = spec.sets.map((s, i) => (i > 0 && spec.copies[i - 1] ? { ...spec.sets[0] } : s));
  let addOns = 0;
  const adapter = b.adapter('bridging-adapter-4', 'Adapter');
  b.cable(ksu.port(2), adapter.plug);
  let jack = 0;
  const usedPorts = new Set<number>();
  sets.forEach((s, i) => {
    const set = b.set(s.template, `Set ${i + 1}`, {
      station: s.station ? ksu.stations[0] : undefined,
      leadChanges: s.leadChanges,
    });
    let cord = set.cord;
    if (s.addOn && addOns < (sets.length >= 4 ? 1 : 2)) {
      addOns++;
      const addOn = b.addOn(set, `Speaker ${i + 1}`);
      b.cable(set.cord, addOn.jack);
      cord = addOn.cord;
    }
    // Port 1 takes one set directly; the others share the adapter on port 2.
    if (s.where === 0 && !usedPorts.has(1)) {
      usedPorts.add(1);
      b.cable(ksu.port(1), cord);
    } else {
      b.cable(adapter.jack(++jack), cord);
    }
  });
  const plan = b.build();
  if (spec.customCrossConnect) {
    const { port, pair, line } = spec.customCrossConnect;
    const standard = standardCrossConnect(plan.ksu).filter((x) => !(x.port === port && x.pair === pair));
    return {
      ...plan,
      ksu: { ...plan.ksu, crossConnect: [...standard, { port, pair, lead: { kind: 'line-talk', line } }] },
    };
  }
  return plan;
}

describe('the default sweep finds what the exhaustive sweep finds', () => {
  it('on random plans of two to four sets', () => {
    const seed = Number(process.env.SWEEP_SEED ?? Date.now() % 1_000_000);
    console.log(`sweep soundness: fast-check seed ${seed} (SWEEP_SEED=${seed} repeats it)`);
    fc.assert(
      fc.property(planSpec, (spec) => {
        const plan = buildPlan(spec);
        const fast = sweep(plan);
        const reference = sweep(plan, { strategy: 'exhaustive' });
        expect(fast.complete).toBe(true);
        expect(found(fast)).toEqual(found(reference));
      }),
      { seed, numRuns: 10 },
    );
  }, 240_000);
});
