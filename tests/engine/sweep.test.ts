import { describe, expect, it } from 'vitest';
import {
  evaluate,
  findingKey,
  planSweep,
  sweep,
  sweepEvents,
  type SweepResult,
} from '../../shared/engine/index';
import { examplePlan } from '../support/example-plans';
import { operate, planBuilder } from '../support/plan-builder';

const example = examplePlan;

const keys = (r: SweepResult) => r.findings.map((f) => findingKey(f.finding)).sort();
const codes = (r: SweepResult) => new Set(r.findings.map((f) => f.finding.code));

describe('sweep of the two-set hands-free plan (demo plan)', () => {
  const plan = example('demo-plan.json');
  const result = sweep(plan);

  it('visits every state exhaustively', () => {
    expect(result.strategy).toBe('exhaustive');
    expect(result.complete).toBe(true);
    // 12 positions for the set without add-on (hook × no key / 5 keys), 24 for the one with; 13 events
    // (none, 5 ringing lines, 2 intercom stations, 5 held lines). Arithmetic over the plan, no published source.
    expect(result.statesVisited).toBe(12 * 24 * 13);
  });

  it('finds the five faults of two hands-free sets bridged on one cable', () => {
    // Trade facts 3, 5, 6, 8 and the shared private leads: common practice, no published source.
    for (const code of [
      'LINES_JOINED',
      'BREAK_IN',
      'LINE_LIT_UNATTENDED',
      'INTERCOM_SOUNDS_SEVERAL',
      'PRIVATE_LEAD_SHARED',
    ]) {
      expect(codes(result), code).toContain(code);
    }
    expect(result.findings.map((f) => f.finding)).toHaveFinding('LINES_JOINED', { lines: [1, 5] });
    expect(result.findings.map((f) => f.finding)).toHaveFinding('INTERCOM_SOUNDS_SEVERAL', {
      stations: ['st-21'],
    });
  });

  it('reports each finding once, with a state that reproduces it word for word, path included', () => {
    expect(new Set(keys(result)).size).toBe(result.findings.length);
    for (const f of result.findings) {
      const state = operate(plan, f.actions);
      expect(state).toEqual(f.state);
      const again = evaluate(plan, state).findings.find((g) => findingKey(g) === findingKey(f.finding));
      expect(again, findingKey(f.finding)).toEqual(f.finding);
    }
  });

  it('gives the smallest reproducing state', () => {
    const size = (code: string, lines?: number[]) =>
      result.findings.find(
        (f) => f.finding.code === code && (!lines || f.finding.lines.join() === lines.join()),
      )?.stateSize;
    // The shared private leads are wiring: seen with every set idle. Common practice, no published source.
    expect(size('PRIVATE_LEAD_SHARED')).toBe(0);
    // Two latched line keys join their lines even with both handsets down. Same source.
    expect(size('LINES_JOINED', [1, 5])).toBe(2);
    // One latched key on one set plus the other set's handset lifted lights that line. Same source.
    expect(size('LINE_LIT_UNATTENDED', [1])).toBe(2);
    // An intercom call alone shows the shared buzzer pair. Same source.
    expect(size('INTERCOM_SOUNDS_SEVERAL')).toBe(1);
    // Each active element takes at least one action to set up.
    for (const f of result.findings) expect(f.stateSize).toBeLessThanOrEqual(f.actions.length);
  });

  it('the fast path finds exactly what replaying every state finds', () => {
    const exact = sweep(plan, { exact: true });
    expect(keys(exact)).toEqual(keys(result));
    expect(exact.findings.map((f) => f.stateSize)).toEqual(result.findings.map((f) => f.stateSize));
  });

  it('one KSU event at a time finds what every combination of events finds', () => {
    const product = sweep(plan, { events: 'product' });
    expect(product.statesVisited).toBeGreaterThan(result.statesVisited);
    expect(keys(product)).toEqual(keys(result));
  });
});

describe('sweep states and events', () => {
  it.each(['two-set.json', 'intercom.json', 'six-and-ten.json'])(
    'the fast path agrees with replaying every state on %s',
    (file) => {
      const plan = example(file);
      const fast = sweep(plan);
      const exact = sweep(plan, { exact: true });
      expect(keys(fast)).toEqual(keys(exact));
      expect(fast.findings.map((f) => f.stateSize)).toEqual(exact.findings.map((f) => f.stateSize));
    },
    30_000,
  );

  it('includes one held line per line a set can hold, and the hold really holds it', () => {
    const plan = example('two-set.json');
    const held = sweepEvents(plan).filter((e) => e.held !== null);
    // The plan's five lines are all on the six-key sets' keys, which have a hold key (template data, our own).
    expect(held.map((e) => e.held)).toEqual([1, 2, 3, 4, 5]);
    // A line put on hold winks on every set: Federal Standard 1037C "wink" (hold) signalling.
    const state = operate(plan, [
      { kind: 'press-key', set: 'counter', key: 2 },
      { kind: 'lift-handset', set: 'counter' },
      { kind: 'press-hold', set: 'counter' },
      { kind: 'hang-up', set: 'counter' },
    ]);
    expect(evaluate(plan, state).lines.find((l) => l.line === 2)?.status).toBe('held');
  });

  it('a single set alone on its own cable shows nothing in any state', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 1 });
    const set = b.set('six-key-hf', 'Alone', { station: ksu.stations[0] });
    b.cable(ksu.port(1), set.cord);
    const result = sweep(b.build());
    expect(result.complete).toBe(true);
    expect(result.findings).toEqual([]);
  });

  it('the reduced strategy, when asked for, visits one set or two sets of one port at a time', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 4 });
    const ad = b.adapter('bridging-adapter-4');
    b.cable(ksu.port(1), ad.plug);
    for (let i = 1; i <= 4; i++) b.cable(ad.jack(i), b.set('six-key-hf', `Set ${i}`).cord);
    const plan = b.build();
    const planned = planSweep(plan);
    expect(planned.strategy).toBe('reduced');
    // At most two sets leave idle: 1 + 4 × 11 + 6 × 11 × 11 mechanical states (arithmetic, no published source).
    expect(planned.combinations).toBe(1 + 4 * 11 + 6 * 121);
    // One set at a time with each of the 15 events (none, 5 ringing lines, 4 intercom calls, 5 held lines), two
    // sets together with no event. Arithmetic over the plan, no published source.
    expect(planned.events).toHaveLength(15);
    expect(planned.total).toBe((1 + 4 * 11) * 15 + 6 * 121);
    const result = sweep(plan, { strategy: 'reduced' });
    expect(result.strategy).toBe('reduced');
    expect(result.complete).toBe(true);
    expect(result.statesVisited).toBe(planned.total);
    // Two hands-free sets with different line keys join their lines: common practice, no published source.
    expect(result.findings.map((f) => f.finding)).toHaveFinding('LINES_JOINED');

    const capped = sweep(plan, { strategy: 'reduced', limit: 100 });
    expect(capped.statesVisited).toBe(100);
    expect(capped.complete).toBe(false);
  });

  it('reports progress, and stops when asked', () => {
    const plan = example('intercom.json');
    const seen: [number, number][] = [];
    const full = sweep(plan, { onProgress: (done, total) => seen.push([done, total]) });
    expect(seen.at(-1)).toEqual([full.statesVisited, full.statesPlanned]);
    expect(seen.every(([done], i) => i === 0 || done >= seen[i - 1][0])).toBe(true);

    // Our own option contract: shouldStop is polled every 64 states, so the third poll stops after 128 of them.
    let polls = 0;
    const stopped = sweep(plan, { shouldStop: () => ++polls > 2 });
    expect(stopped.complete).toBe(false);
    expect(stopped.statesVisited).toBe(128);
  });
});
