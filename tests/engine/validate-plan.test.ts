/**
 * Plan validation and cable rules. Check values: the expected messages are this product's own wording (no published
 * source); the plug-to-jack rule is common practice for 25-pair connectorised cabling, no published source.
 */
import { describe, expect, it } from 'vitest';
import { canConnect, validatePlan, type PlanInput } from '../../shared/engine/index';
import { planBuilder } from '../support/plan-builder';

function base() {
  const b = planBuilder();
  const ksu = b.ksu({ lines: 5, stations: 2, ports: 2 });
  const a = b.set('six-key-hf', 'Front');
  const c = b.set('six-key', 'Back');
  const ad = b.adapter();
  b.cable(ksu.port(1), ad.plug);
  b.cable(ad.jack(1), a.cord);
  b.cable(ad.jack(2), c.cord);
  return { b, ksu, a, c, ad };
}

function issuesOf(mutate: (doc: PlanInput) => void) {
  const doc = base().b.input();
  mutate(doc);
  const r = validatePlan(doc);
  if (r.ok) return [];
  return r.issues;
}

describe('validatePlan', () => {
  it('accepts a good plan and returns it with defaults filled in', () => {
    const r = validatePlan(base().b.input());
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.plan.required.allLinesOnEverySet).toBe(true);
  });

  it('reports schema errors with their path', () => {
    expect(issuesOf((d) => (d.sets![0].id = 'Front Desk'))).toContainEqual({
      path: 'sets[0].id',
      message: 'Use 1–40 lower-case letters, digits or dashes, starting with a letter',
    });
    expect(validatePlan(null).ok).toBe(false);
  });

  it.each([
    [
      'unknown template',
      (d: PlanInput) => (d.sets![1].template = 'twelve-key'),
      'sets[1].template',
      'Unknown key set template "twelve-key"',
    ],
    [
      'wrong kind of template',
      (d: PlanInput) => (d.sets![1].template = 'bridging-adapter'),
      'sets[1].template',
      '"bridging-adapter" is an adapter template, not a key set one',
    ],
    [
      'unknown adapter template',
      (d: PlanInput) => (d.adapters![0].template = 'splitter'),
      'adapters[0].template',
      'Unknown adapter template "splitter"',
    ],
    [
      'duplicate ids',
      (d: PlanInput) => (d.sets![1].id = 'front'),
      'sets[1].id',
      'Id "front" is already used (sets[0].id)',
    ],
    [
      'duplicate cable ids',
      (d: PlanInput) => (d.cables![2].id = 'c1'),
      'cables[2].id',
      'Cable id "c1" is already used (cables[0])',
    ],
    [
      'cable to an unknown part',
      (d: PlanInput) => (d.cables![1].to = { part: 'nowhere', port: 'cord' }),
      'cables[1].to.part',
      'No part "nowhere" in the plan',
    ],
    [
      'cable to an unknown port',
      (d: PlanInput) => (d.cables![0].to = { part: 'adapter', port: 'jack-9' }),
      'cables[0].to.port',
      'Adapter has no port "jack-9" (its ports: plug, jack-1, jack-2)',
    ],
    [
      'KSU port beyond its ports',
      (d: PlanInput) => (d.cables![0].from = { part: 'ksu', port: 'port-3' }),
      'cables[0].from.port',
      'KSU has no port "port-3" (its ports: port-1, port-2)',
    ],
    [
      'port used twice',
      (d: PlanInput) => (d.cables![2].from = { part: 'adapter', port: 'jack-1' }),
      'cables[2].from.port',
      "Adapter's jack-1 is already used by cable c2",
    ],
    [
      'part cabled to itself',
      (d: PlanInput) => (d.cables![2].to = { part: 'adapter', port: 'plug' }),
      'cables[2].to.part',
      'A cable cannot join a part to itself',
    ],
    [
      'plug to plug',
      (d: PlanInput) => (d.cables![2].from = { part: 'front', port: 'cord' }),
      'cables[2].to.port',
      'Both ends are plugs; a cable joins a plug to a jack',
    ],
    [
      'unknown station',
      (d: PlanInput) => (d.sets![0].station = 'st-99'),
      'sets[0].station',
      'No intercom station "st-99" on the KSU',
    ],
    [
      'ringer on a missing line',
      (d: PlanInput) => (d.sets![0].ringerLines = [7]),
      'sets[0].ringerLines[0]',
      "Line 7 is beyond the KSU's 5 lines",
    ],
    [
      'add-on serving a non-set',
      (d: PlanInput) =>
        d.addOns!.push({ id: 'unit', name: 'Unit', template: 'hands-free-unit', serves: 'adapter' }),
      'addOns[0].serves',
      '"adapter" is not a key set; an add-on serves a key set',
    ],
    [
      'add-on serving nothing',
      (d: PlanInput) =>
        d.addOns!.push({ id: 'unit', name: 'Unit', template: 'hands-free-unit', serves: 'ghost' }),
      'addOns[0].serves',
      'No key set "ghost" in the plan; an add-on serves a key set',
    ],
    [
      'cross-connect beyond the lines',
      (d: PlanInput) => (d.ksu.crossConnect = [{ port: 1, pair: 1, lead: { kind: 'line-talk', line: 8 } }]),
      'ksu.crossConnect[0].lead.line',
      "Line 8 is beyond the KSU's 5 lines",
    ],
    [
      'cross-connect beyond the ports',
      (d: PlanInput) => (d.ksu.crossConnect = [{ port: 5, pair: 1, lead: { kind: 'line-talk', line: 1 } }]),
      'ksu.crossConnect[0].port',
      'The KSU has 2 station ports; there is no port 5',
    ],
    [
      'cross-connect to an unknown station',
      (d: PlanInput) =>
        (d.ksu.crossConnect = [{ port: 1, pair: 18, lead: { kind: 'buzzer', station: 'st-9' } }]),
      'ksu.crossConnect[0].lead.station',
      'No intercom station "st-9" on the KSU',
    ],
    [
      'lift of a spare pair',
      (d: PlanInput) => (d.sets![1].leadChanges = [{ kind: 'lift', pair: 23, conductor: 'both' }]),
      'sets[1].leadChanges[0].pair',
      'Pair 23 carries no leads here at that point',
    ],
    [
      'move onto a used pair',
      (d: PlanInput) => (d.sets![1].leadChanges = [{ kind: 'move', pair: 18, toPair: 1 }]),
      'sets[1].leadChanges[0].toPair',
      'Pair 1 already carries leads; move onto a spare pair',
    ],
    [
      'unknown hands-free set',
      (d: PlanInput) => (d.required = { handsFreeSets: ['ghost'] }),
      'required.handsFreeSets[0]',
      'No key set "ghost" in the plan',
    ],
    [
      'line listed twice',
      (d: PlanInput) => (d.ksu.lines[1].number = 1),
      'ksu.lines[1].number',
      'Line 1 is listed twice',
    ],
  ])('reports %s at its exact path', (_name, mutate, path, message) => {
    expect(issuesOf(mutate)).toContainEqual({ path, message });
  });

  it('accepts a move onto a spare pair and a lift of a used one', () => {
    expect(
      issuesOf(
        (d) =>
          (d.sets![1].leadChanges = [
            { kind: 'move', pair: 18, toPair: 17 },
            { kind: 'lift', pair: 1, conductor: 'tip' },
          ]),
      ),
    ).toEqual([]);
  });
});

describe('canConnect', () => {
  it('allows a plug to a free jack', () => {
    const { b } = base();
    const unit = b.set('single-line', 'Hall');
    const plan = b.build();
    expect(canConnect(plan, unit.cord, { part: 'ksu', port: 'port-2' })).toEqual({ ok: true });
  });

  it.each([
    [
      { part: 'front', port: 'cord' },
      { part: 'back', port: 'cord' },
      'Both ends are plugs: a cable joins a plug to a jack.',
    ],
    [
      { part: 'ksu', port: 'port-2' },
      { part: 'adapter', port: 'jack-1' },
      'Both ends are jacks: a cable joins a plug to a jack.',
    ],
    [
      { part: 'adapter', port: 'plug' },
      { part: 'adapter', port: 'jack-2' },
      'Adapter cannot be cabled to itself.',
    ],
    [
      { part: 'front', port: 'cord' },
      { part: 'ksu', port: 'port-2' },
      "Front's cord is already used by cable c2.",
    ],
    [
      { part: 'ghost', port: 'cord' },
      { part: 'ksu', port: 'port-2' },
      'There is no part "ghost" in this plan.',
    ],
    [{ part: 'front', port: 'jack' }, { part: 'ksu', port: 'port-2' }, 'Front has no port "jack".'],
  ])('refuses %o to %o with a reason', (from, to, reason) => {
    expect(canConnect(base().b.build(), from, to)).toEqual({ ok: false, reason });
  });
});

describe('validatePlan: wiring faults in a cable', () => {
  type Faults = NonNullable<NonNullable<PlanInput['cables']>[number]['faults']>;
  const withFaults = (faults: unknown) => (d: PlanInput) => (d.cables![1].faults = faults as Faults);

  it('accepts one fault of each kind on different pairs, and a cable without faults', () => {
    expect(issuesOf(() => undefined)).toEqual([]);
    expect(
      issuesOf(
        withFaults([
          { kind: 'split-pair', pair: 1, withPair: 4, conductor: 'tip', end: 'to' },
          { kind: 'reversed-pair', pair: 7, end: 'from' },
          { kind: 'open-conductor', pair: 18, conductor: 'ring', end: 'to' },
        ]),
      ),
    ).toEqual([]);
  });

  // Pairs 1–25: ICEA S-80-576; the messages are our own wording (no published source).
  it.each<[string, unknown, string, string]>([
    [
      'a pair beyond 25',
      [{ kind: 'reversed-pair', pair: 26, end: 'from' }],
      'cables[1].faults[0].pair',
      'Too big: expected number to be <=25',
    ],
    [
      'a split onto the same pair',
      [{ kind: 'split-pair', pair: 4, withPair: 4, conductor: 'ring', end: 'to' }],
      'cables[1].faults[0].withPair',
      'A split pair needs two different pairs',
    ],
    [
      'two faults on one pair',
      [
        { kind: 'open-conductor', pair: 2, conductor: 'tip', end: 'to' },
        { kind: 'split-pair', pair: 5, withPair: 2, conductor: 'tip', end: 'from' },
      ],
      'cables[1].faults[1].withPair',
      'Pair 2 already has a wiring fault in this cable (cables[1].faults[0])',
    ],
    [
      'an unknown end',
      [{ kind: 'reversed-pair', pair: 3, end: 'middle' }],
      'cables[1].faults[0].end',
      'Invalid option: expected one of "from"|"to"',
    ],
    [
      'more than twelve faults',
      Array.from({ length: 13 }, (_, i) => ({ kind: 'reversed-pair', pair: i + 1, end: 'to' })),
      'cables[1].faults',
      'Too big: expected array to have <=12 items',
    ],
  ])('reports %s at its exact path', (_name, faults, path, message) => {
    expect(issuesOf(withFaults(faults))).toContainEqual({ path, message });
  });
});
