/** The readable changes between two plan versions (shared/plans/plan-diff.ts). */
import { describe, expect, it } from 'vitest';
import { diffPlans } from '../../shared/plans/plan-diff';
import { standardCrossConnect, type Plan } from '../../shared/engine/index';
import { planBuilder } from '../support/plan-builder';

function twoSets(): Plan {
  const b = planBuilder('Diff bench');
  const ksu = b.ksu({ lines: 2 });
  const ad = b.adapter('bridging-adapter');
  b.cable(ksu.port(1), ad.plug);
  b.cable(ad.jack(1), b.set('six-key', 'Counter').cord);
  b.cable(ad.jack(2), b.set('six-key', 'Office').cord);
  return b.build();
}

const texts = (a: Plan, b: Plan) => diffPlans(a, b).map((c) => `${c.kind}: ${c.text}`);

describe('diffPlans', () => {
  it('finds nothing between a plan and itself, nor when parts only moved on the drawing', () => {
    const plan = twoSets();
    expect(diffPlans(plan, plan)).toEqual([]);
    const moved = structuredClone(plan);
    moved.sets[0].position = { x: 999, y: 999 };
    expect(diffPlans(plan, moved)).toEqual([]);
  });

  it('names lifted, moved and restored leads with their 25-pair colours', () => {
    const before = twoSets();
    const after = structuredClone(before);
    const [counter, office] = after.sets;
    counter.leadChanges = [{ kind: 'lift', pair: 2, conductor: 'tip' }];
    office.leadChanges = [{ kind: 'move', pair: 1, toPair: 17 }];
    // Pair 2 white-orange, pair 1 white-blue, pair 17 yellow-orange (ICEA S-80-576 colour code: tips white, red,
    // black, yellow, violet by groups of five; rings blue, orange, green, brown, slate).
    expect(texts(before, after)).toEqual([
      'lead-lifted: Counter: pair 2 (white-orange) tip lifted',
      'lead-moved: Office: pair 1 (white-blue) moved to pair 17 (yellow-orange)',
    ]);
    expect(texts(after, before)).toEqual([
      'lead-restored: Counter: pair 2 (white-orange) back on its terminals (was tip lifted)',
      'lead-restored: Office: pair 1 (white-blue) back on its terminals (was moved to pair 17 (yellow-orange))',
    ]);
  });

  it('lists parts added and removed, and cables laid, pulled and re-plugged', () => {
    const before = twoSets();
    const after = structuredClone(before);
    const office = after.sets.pop()!;
    after.cables = after.cables.filter((c) => c.to.part !== office.id && c.from.part !== office.id);
    const moved = after.cables.find(
      (c) => c.from.part === after.sets[0].id || c.to.part === after.sets[0].id,
    )!;
    const jackEnd = moved.from.part === after.sets[0].id ? 'to' : 'from';
    moved[jackEnd] = { ...moved[jackEnd], port: 'jack-2' };
    const changes = diffPlans(before, after);
    expect(changes.map((c) => c.kind).sort()).toEqual(['cable-changed', 'cable-removed', 'part-removed']);
    expect(changes.find((c) => c.kind === 'part-removed')?.text).toBe('Removed set Office');
    expect(changes.find((c) => c.kind === 'cable-changed')?.text).toMatch(/jack-2 .*\(was .*jack-1.*\)$/);
  });

  it('reports cross-connect edits at the KSU, from the standard station plan to an edited one', () => {
    const before = twoSets();
    const after = structuredClone(before);
    const plan = standardCrossConnect(after.ksu);
    const talk = plan.find((c) => c.port === 1 && c.lead.kind === 'line-talk' && c.lead.line === 1)!;
    after.ksu.crossConnect = plan.map((c) =>
      c === talk ? { ...c, lead: { kind: 'line-talk', line: 2 } } : c,
    );
    after.ksu.crossConnect.push({ port: 1, pair: 20, lead: { kind: 'line-lamp', line: 1 } });
    expect(texts(before, after)).toEqual([
      `cross-connect-changed: KSU port 1, pair ${talk.pair} (white-blue): line 1 talk → line 2 talk`,
      'cross-connect-added: KSU port 1, pair 20 (yellow-slate): now line 1 lamp',
    ]);
  });

  it('tells renames and required-function edits', () => {
    const before = twoSets();
    const after = { ...structuredClone(before), name: 'Diff bench, rewired' };
    after.required.allLinesOnEverySet = false;
    expect(texts(before, after)).toEqual([
      'plan-renamed: Renamed from “Diff bench” to “Diff bench, rewired”',
      'required-changed: Required functions changed',
    ]);
  });
});
