/**
 * Wiring faults inside a cable and what a user sees because of them. The symptoms are trade knowledge
 * (common practice, no published source); the pair plan is our own (templates/README.md), the pins are
 * USOC RJ21X (ring of pair n on pin n, tip on pin n+25) and the colours ICEA S-80-576.
 */
import { describe, expect, it } from 'vitest';
import { evaluate, PlanSchema, type Plan, type SimAction, type WiringFault } from '../../shared/engine/index';
import { cableWires } from '../../shared/engine/model/cable-faults';
import { operate, planBuilder } from '../support/plan-builder';
import '../support/matchers';
import { sightingOf } from '../../shared/training/sightings';

/** KSU port 1 → one set's cord on cable c1, with the given faults in that cable. */
function oneSet(template: string, faults: WiringFault[] = []) {
  const b = planBuilder();
  const ksu = b.ksu({ lines: 5, stations: 1 });
  const set = b.set(template, 'Desk', { station: 'st-21' });
  b.cable(ksu.port(1), set.cord, 'c1');
  return { plan: withCableFaults(b.input(), 'c1', faults), set: set.id };
}

function withCableFaults(input: ReturnType<ReturnType<typeof planBuilder>['input']>, cable: string, faults: WiringFault[]): Plan {
  return PlanSchema.parse({
    ...input,
    cables: input.cables!.map((c) => (c.id === cable && faults.length ? { ...c, faults } : c)),
  });
}

const onLine = (set: string, key: number): SimAction[] => [
  { kind: 'press-key', set, key },
  { kind: 'lift-handset', set },
];

describe('healthy cable', () => {
  it('gives dial tone, a steady lamp, no notes and no hum on line 1', () => {
    const { plan, set } = oneSet('ten-key');
    const ev = evaluate(plan, operate(plan, onLine(set, 1)));
    expect(ev.sets[0].tones).toEqual([{ tone: 'dial', line: 1 }]); // common practice, no published source
    expect(ev.sets[0].keys[0].lamp).toBe('steady'); // in use: steady (common practice, no published source)
    expect(ev.sets[0].notes).toBeUndefined();
    expect(ev.lines[0].noise).toBeUndefined();
    expect(ev.findings).toEqual([]);
  });
});

describe('open conductor', () => {
  it('on the talk pair: line 1 gives no dial tone at the set, though its A-lead still lights the lamp', () => {
    // Pair 1 is line 1's talk pair in our pair plan; a broken ring opens the loop (common practice, no published source).
    const { plan, set } = oneSet('six-key', [{ kind: 'open-conductor', pair: 1, conductor: 'ring', end: 'to' }]);
    const ev = evaluate(plan, operate(plan, onLine(set, 1)));
    expect(ev.sets[0].hears).toEqual([]);
    expect(ev.sets[0].tones).toEqual([]);
    expect(ev.lines[0]).toMatchObject({ status: 'in-use', loopClosed: false });
    expect(ev.sets[0].keys[0].lamp).toBe('steady');
  });

  it('on the A-lead: the KSU never sees line 1 taken and its lamp stays dark', () => {
    // Pair 2 tip is line 1's A-lead (our pair plan); without it the line circuit does not light the lamp
    // (common practice, no published source).
    const { plan, set } = oneSet('six-key', [{ kind: 'open-conductor', pair: 2, conductor: 'tip', end: 'from' }]);
    const ev = evaluate(plan, operate(plan, onLine(set, 1)));
    expect(ev.lines[0].aClosed).toBe(false);
    expect(ev.lines[0].status).toBe('idle');
    expect(ev.sets[0].keys[0].lamp).toBe('dark');
  });

  it('on the lamp lead: the lamp of line 1 stays dark while the line is in use', () => {
    // Pair 3 tip is line 1's lamp lead (our pair plan).
    const { plan, set } = oneSet('six-key', [{ kind: 'open-conductor', pair: 3, conductor: 'tip', end: 'to' }]);
    const ev = evaluate(plan, operate(plan, onLine(set, 1)));
    expect(ev.lines[0].status).toBe('in-use');
    expect(ev.sets[0].keys[0].lamp).toBe('dark');
  });

  it('on the buzzer pair: an intercom call to the set is silent', () => {
    // Pair 18 is the buzzer pair (our pair plan).
    const healthy = oneSet('six-key');
    const call: SimAction[] = [{ kind: 'intercom-call', station: 'st-21' }];
    expect(evaluate(healthy.plan, operate(healthy.plan, call)).sets[0].buzzer).toBe(true);
    const { plan } = oneSet('six-key', [{ kind: 'open-conductor', pair: 18, conductor: 'ring', end: 'to' }]);
    expect(evaluate(plan, operate(plan, call)).sets[0].buzzer).toBe(false);
  });
});

describe('reversed pair', () => {
  it('on the talk pair of a set without polarised parts: talk and dial tone still work', () => {
    // Talk and rotary (loop) dialling do not care which way round tip and ring are (common practice, no published source).
    const { plan, set } = oneSet('six-key', [{ kind: 'reversed-pair', pair: 1, end: 'from' }]);
    const ev = evaluate(plan, operate(plan, onLine(set, 1)));
    expect(ev.sets[0].tones).toEqual([{ tone: 'dial', line: 1 }]);
    expect(ev.sets[0].notes).toBeUndefined();
  });

  it('on the talk pair of the single-line set: it talks but its tone dial does not dial', () => {
    // A line-powered tone dial needs tip positive to ring (common practice, no published source).
    const { plan, set } = oneSet('single-line', [{ kind: 'reversed-pair', pair: 1, end: 'to' }]);
    const ev = evaluate(plan, operate(plan, [{ kind: 'lift-handset', set }]));
    expect(ev.sets[0].tones).toEqual([{ tone: 'dial', line: 1 }]);
    expect(ev.sets[0].notes).toEqual(['On line 1 its tone dial does not work: tip and ring reach it reversed.']);
    const healthy = oneSet('single-line');
    expect(evaluate(healthy.plan, operate(healthy.plan, [{ kind: 'lift-handset', set }])).sets[0].notes).toBeUndefined();
  });

  it('on the lamp pair: the lamp lead meets the shared lamp ground and line 1 stays dark on the key', () => {
    // A set's lamps share LG (our pair plan), so a reversed lamp pair grounds the lamp lead (common practice,
    // no published source).
    const { plan, set } = oneSet('six-key', [{ kind: 'reversed-pair', pair: 3, end: 'from' }]);
    const ev = evaluate(plan, operate(plan, onLine(set, 1)));
    expect(ev.lines[0].status).toBe('in-use');
    expect(ev.sets[0].keys[0]).toMatchObject({ lamp: 'dark', lines: [] });
    expect(ev.sets[0].tones).toEqual([{ tone: 'dial', line: 1 }]);
  });
});

describe('split pair', () => {
  /** Two sets on KSU port 1 through an adapter; the tips of pairs 1 and 4 (lines 1 and 2 talk) split in Back's cable. */
  function twoSets(split: boolean) {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 2 });
    const front = b.set('six-key', 'Front');
    const back = b.set('six-key', 'Back');
    const ad = b.adapter();
    b.cable(ksu.port(1), ad.plug, 'c1');
    b.cable(ad.jack(1), front.cord, 'c2');
    b.cable(ad.jack(2), back.cord, 'c3');
    const faults: WiringFault[] = split
      ? [{ kind: 'split-pair', pair: 1, withPair: 4, conductor: 'tip', end: 'to' }]
      : [];
    return { plan: withCableFaults(b.input(), 'c3', faults), front: front.id, back: back.id };
  }

  it('leaves the set past the split without its line, and hums on both lines when both are in use', () => {
    const { plan, front, back } = twoSets(true);
    const ev = evaluate(plan, operate(plan, [...onLine(front, 1), ...onLine(back, 2)]));
    // Front (healthy cable) still has line 1; Back's line 2 loop runs over line 1's tip, so neither is its loop.
    expect(ev.sets[0].tones).toEqual([{ tone: 'dial', line: 1 }]);
    expect(ev.sets[1].hears).toEqual([]);
    expect(ev.lines[1]).toMatchObject({ status: 'in-use', loopClosed: false });
    // Crosstalk between the two circuits of the split (common practice, no published source).
    expect(ev.lines[0].noise?.[0]).toMatch(/^Hum on line 1, and line 2 is heard faintly: in cable c3 the tip of pair 1/);
    expect(ev.lines[1].noise?.[0]).toMatch(/^Hum on line 2, and line 1 is heard faintly/);
  });

  it('lets a person at the set hear the hum (the trainee sighting), and only over the split', () => {
    const faulty = twoSets(true);
    const healthy = twoSets(false);
    const state = (p: typeof faulty) => operate(p.plan, [...onLine(p.front, 1), ...onLine(p.back, 2)]);
    // Crosstalk over a split pair is audible in the handset (common practice, no published source).
    expect(sightingOf(faulty.plan, state(faulty)).sets.map((s) => s.hum)).toEqual([true, false]);
    expect(sightingOf(healthy.plan, state(healthy)).sets.map((s) => s.hum)).toEqual([false, false]);
  });

  it('is quiet and works on both lines with the cable healthy', () => {
    const { plan, front, back } = twoSets(false);
    const ev = evaluate(plan, operate(plan, [...onLine(front, 1), ...onLine(back, 2)]));
    expect(ev.sets.map((s) => s.hears)).toEqual([[1], [2]]);
    expect(ev.lines.map((l) => l.noise)).toEqual([undefined, undefined, undefined, undefined, undefined]);
  });

  it('gives Back no loop but hum when it takes line 1 over the split', () => {
    // Back's line key 1 puts its network across line 2's tip and line 1's ring: no loop of its own, and the
    // split pairs carry both circuits (common practice, no published source).
    const { plan, front, back } = twoSets(true);
    const ev = evaluate(plan, operate(plan, [...onLine(front, 1), ...onLine(back, 1)]));
    expect(ev.sets[1].hears).toEqual([]);
    expect(ev.lines[0].noise?.length).toBe(1);
  });
});

describe('the conductors of a cable', () => {
  // RJ21X: ring of pair n on pin n, tip on pin n+25 (USOC RJ21X).
  const cable = (faults?: WiringFault[]) => ({ id: 'c1', from: { part: 'ksu', port: 'port-1' }, to: { part: 'desk', port: 'cord' }, faults });
  const pinPairs = (faults?: WiringFault[]) => cableWires(cable(faults)).map((w) => [w.fromPin, w.toPin]);

  it('are pin for pin on a healthy cable: 50 conductors', () => {
    expect(pinPairs()).toEqual(Array.from({ length: 50 }, (_, i) => [i + 1, i + 1]));
  });

  it('leave a broken conductor out and swap the pins of a split or a reversal', () => {
    const open = pinPairs([{ kind: 'open-conductor', pair: 2, conductor: 'tip', end: 'from' }]);
    expect(open).toHaveLength(49);
    expect(open.some(([a]) => a === 27)).toBe(false); // tip of pair 2 on pin 27
    const split = pinPairs([{ kind: 'split-pair', pair: 1, withPair: 4, conductor: 'tip', end: 'to' }]);
    expect(split.filter(([a, b]) => a !== b)).toEqual([[26, 29], [29, 26]]); // tips of pairs 1 and 4: pins 26, 29
    const reversed = pinPairs([{ kind: 'reversed-pair', pair: 3, end: 'from' }]);
    expect(reversed.filter(([a, b]) => a !== b)).toEqual([[3, 28], [28, 3]]);
  });

  it('carry faults made at the two ends together: a reversal at one end, a break near the other', () => {
    const both = pinPairs([
      { kind: 'reversed-pair', pair: 1, end: 'from' },
      { kind: 'open-conductor', pair: 4, conductor: 'ring', end: 'to' },
    ]);
    expect(both).toHaveLength(49);
    expect(both.filter(([a, b]) => a !== b)).toEqual([[1, 26], [26, 1]]); // pair 1: pins 1 and 26
    expect(both.some(([, b]) => b === 4)).toBe(false); // ring of pair 4 on pin 4
  });
});
