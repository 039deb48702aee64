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
  sweep,
  type Plan,
  type SweepResult,
} from '../../shared/engine/index';
import { operate, planBuilder } from '../support/plan-builder';
import { buildPlan, planSpec, propertySeed } from '../support/random-plans';

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

  it('identical sets that reach the same nets by different routes keep their own wiring findings', () => {
    // Two single-line sets with hands-free add-ons, one on port 1 of a nine-line KSU, the other on port 2's adapter
    // beside a ten-key set: the standard cross-connect puts both on the same nets, so they are traded as one, but
    // only the add-on on the shared adapter is paralleled pin for pin with the ten-key set's private leads.
    const plan = buildPlan({
      lines: 9,
      sets: [
        { template: 'single-line', addOn: true, where: 0, station: false, leadChanges: [] },
        { template: 'ten-key', addOn: false, where: 0, station: false, leadChanges: [] },
        { template: 'six-key', addOn: false, where: 0, station: false, leadChanges: [] },
      ],
      copies: [false, true, false],
      customCrossConnect: null,
    });
    expect(interchangeableSets(plan)).toEqual([[0, 2]]);
    const result = expectSameAsExhaustive(plan);
    const shared = result.findings
      .filter((f) => f.finding.code === 'PRIVATE_LEAD_SHARED')
      .map((f) => [...f.finding.sets].sort().join(' + '));
    expect(shared).toContain('set-2 + speaker-3');
    expect(shared).not.toContain('set-2 + speaker-1');
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

describe('the default sweep finds what the exhaustive sweep finds', () => {
  it('on random plans of two to four sets', () => {
    const seed = propertySeed('sweep soundness');
    fc.assert(
      fc.property(planSpec, (spec) => {
        const plan = buildPlan(spec);
        const fast = sweep(plan);
        // Some seeds draw a plan past the complete sweep's limit: it must say so, and there is nothing to compare.
        if (!fast.complete) {
          expect(fast.incompleteReason).toMatch(/^Too large for a complete sweep/);
          return;
        }
        const reference = sweep(plan, { strategy: 'exhaustive' });
        expect(found(fast)).toEqual(found(reference));
      }),
      { seed, numRuns: 10 },
    );
  }, 240_000);
});
