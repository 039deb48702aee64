/** Lead changes and partial adapters, as the restorer would make them (common practice, no published source). */
import { describe, expect, it } from 'vitest';
import { evaluate, PlanSchema, type LeadChange } from '../../shared/engine/index';
import { operate, planBuilder, setsOnOneCable } from '../support/plan-builder';

const conference = (a: string, b: string) =>
  [
    { kind: 'press-key', set: a, key: 1 },
    { kind: 'press-key', set: b, key: 5 },
    { kind: 'lift-handset', set: b },
  ] as const;

describe('lifting one conductor', () => {
  it('leaves the lines joined through the other conductor of the pair', () => {
    const tipOnly: LeadChange[] = [{ kind: 'lift', pair: 23, conductor: 'tip' }];
    const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf'], {
      sets: [{ leadChanges: tipOnly }, {}],
    });
    const ev = evaluate(plan, operate(plan, [...conference(a, b)]));
    expect(ev).toHaveFinding('LINES_JOINED', { lines: [1, 5] });
    expect(ev.sets.find((s) => s.set === b)!.hears).toEqual([5]); // no loop on line 1 through one conductor
    const path = ev.findings.find((f) => f.code === 'LINES_JOINED')!.path;
    expect(path.some((h) => h.pair === 23 && h.conductor === 'ring')).toBe(true);
  });
});

describe('moving a pair', () => {
  it('takes the leads off their old pins and puts them on the new pair', () => {
    const moved: LeadChange[] = [{ kind: 'move', pair: 23, toPair: 19 }];
    const { plan, a, b } = setsOnOneCable(['six-key-hf', 'six-key-hf'], {
      sets: [{ leadChanges: moved }, {}],
    });
    const ev = evaluate(plan, operate(plan, [...conference(a, b)]));
    expect(ev).not.toHaveFinding('LINES_JOINED');
    // the A-lead control on pair 25 is still shared: line 1 still lights
    expect(ev).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [1] });
  });
});

describe('an adapter that bridges only some pairs', () => {
  it('keeps the sets’ own circuits apart when pairs 23–25 are left out', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5, stations: 2 });
    const x = b.set('six-key-hf', 'Front');
    const y = b.set('six-key-hf', 'Back');
    const ad = b.adapter();
    b.cable(ksu.port(1), ad.plug);
    b.cable(ad.jack(1), x.cord);
    b.cable(ad.jack(2), y.cord);
    const doc = b.input();
    doc.adapters![0].bridgedPairs = Array.from({ length: 22 }, (_, i) => i + 1);
    const plan = PlanSchema.parse(doc);
    const ev = evaluate(plan, operate(plan, [...conference(x.id, y.id)]));
    expect(ev.findings).toEqual([]);
    expect(ev.lines.filter((l) => l.aClosed).map((l) => l.line)).toEqual([5]);
  });
});
