import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { PlanSchema, TEMPLATES, getTemplate, validatePlan, type Plan, type PortRef } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import intercom from '@shared/engine/examples/intercom.json';
import sixAndTen from '@shared/engine/examples/six-and-ten.json';
import twoSet from '@shared/engine/examples/two-set.json';
import * as edits from '@/bench/plan-edits';
import { blankPlan } from '@/plans/plan-starters';
import { twoSetPlan } from './bench-fixture';

/** The outcome's plan, failing the test when the edit was refused. */
function accepted(outcome: edits.EditOutcome): Plan {
  if (!outcome.ok) throw new Error(`Edit refused: ${outcome.reason}`);
  return outcome.plan;
}

function expectValid(plan: Plan) {
  const verdict = validatePlan(JSON.parse(JSON.stringify(plan)));
  expect(verdict.ok ? [] : verdict.issues).toEqual([]);
}

const at = { x: 0, y: 0 };

describe('id allocation', () => {
  it('gives a second intercom station its own id on an empty installation (codes 21 then 22)', () => {
    let plan = blankPlan('Empty installation');
    plan = accepted(edits.addStation(plan, '21', ''));
    plan = accepted(edits.addStation(plan, '22', ''));
    expect(new Set(plan.ksu.stations.map((s) => s.id)).size).toBe(2);
    expectValid(plan);
  });

  it('never reuses a station id after a station is removed and another added', () => {
    let plan = blankPlan('Empty installation');
    plan = accepted(edits.addStation(plan, '21', ''));
    plan = accepted(edits.addStation(plan, '22', ''));
    plan = accepted(edits.removeStation(plan, plan.ksu.stations[0].id));
    plan = accepted(edits.addStation(plan, '21', ''));
    expect(new Set(plan.ksu.stations.map((s) => s.id)).size).toBe(2);
    expectValid(plan);
  });

  it('skips an id held by any other kind of thing in the plan', () => {
    const plan: Plan = {
      ...twoSetPlan(),
      ksu: { ...twoSetPlan().ksu, stations: [{ id: 'set-1', code: '7', label: '' }] },
      adapters: [{ id: 'station-1', name: 'Bridge', template: 'bridging-adapter' }],
      cables: [],
    };
    expect(edits.nextId(plan, 'set')).toBe('set-2');
    expect(edits.nextId(plan, 'station')).toBe('station-2');
    const withSet = accepted(edits.addSet(plan, 'six-key', at));
    expect(withSet.sets.at(-1)?.id).toBe('set-2');
  });
});

describe('plan edits', () => {
  it('refuses a second station with the same intercom code and leaves the plan as it was', () => {
    const plan = accepted(edits.addStation(blankPlan('Empty'), '21', ''));
    const again = edits.addStation(plan, '21', '');
    expect(again.ok).toBe(false);
    if (!again.ok) expect(again.reason).toContain('21');
  });

  it('removing a set takes its add-ons, its cables and its hands-free requirement with it', () => {
    const base = twoSetPlan();
    let plan = accepted(edits.addAddOn(base, 'hands-free-unit', 'front', at));
    plan = { ...plan, required: { ...plan.required, handsFreeSets: ['front'] } };
    plan = accepted(edits.removePart(plan, 'front'));
    expect(plan.sets.map((s) => s.id)).toEqual(['back']);
    expect(plan.addOns).toEqual([]);
    expect(plan.cables.map((c) => c.id)).toEqual(['c-ksu', 'c-back']);
    expect(plan.required.handsFreeSets).toEqual([]);
    expectValid(plan);
  });

  it('records the plug end of a new cable as its from end', () => {
    let plan = accepted(edits.removePart(twoSetPlan(), 'c-front'));
    plan = accepted(edits.connect(plan, { part: 'ksu', port: 'port-2' }, { part: 'front', port: 'cord' }));
    expect(plan.cables.at(-1)?.from).toEqual({ part: 'front', port: 'cord' });
    expectValid(plan);
  });

  it('refuses a lead change on a pair that carries no leads, in the engine words', () => {
    // Pair 25 of the six-key set's cord carries no lead (our own six-key template, shared/engine/templates).
    const spare = getTemplate('six-key')?.leads.some((l) => l.pair === 25);
    expect(spare).toBe(false);
    const result = edits.liftLead(twoSetPlan(), 'front', 25);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toContain('Pair 25');
  });

  it('restoring a moved pair that another move now lands on is refused, not left inconsistent', () => {
    const tpl = getTemplate('six-key');
    const used = new Set(tpl?.leads.map((l) => l.pair));
    const [a, b] = [...used];
    const spare = Array.from({ length: 25 }, (_, i) => i + 1).find((p) => !used.has(p)) ?? 25;
    let plan = accepted(edits.moveLead(twoSetPlan(), 'front', a, spare));
    plan = accepted(edits.moveLead(plan, 'front', b, a));
    const restored = edits.restoreLead(plan, 'front', a);
    expect(restored.ok).toBe(false);
  });

  it('new lines take directory numbers no other line has', () => {
    const base = blankPlan('Empty', 2);
    const clash = {
      ...base,
      ksu: { ...base.ksu, lines: [base.ksu.lines[0], { ...base.ksu.lines[1], directoryNumber: '5550103' }] },
    };
    const plan = accepted(edits.setLineCount(clash, 4));
    expect(plan.ksu.lines.map((l) => l.number)).toEqual([1, 2, 3, 4]);
    expectValid(plan);
  });

  it('will not remove a station whose buzzer is cross-connected', () => {
    const plan = PlanSchema.parse(intercom);
    const buzzed = plan.ksu.crossConnect?.find((cc) => cc.lead.kind === 'buzzer');
    expect(buzzed?.lead.kind).toBe('buzzer');
    if (buzzed?.lead.kind === 'buzzer') expect(edits.removeStation(plan, buzzed.lead.station).ok).toBe(false);
  });
});

// ---- property: random tray and canvas edits keep a plan the engine accepts -------------------------

const STARTS: [string, Plan][] = [
  ['empty installation', blankPlan('Empty installation')],
  ['fixture', twoSetPlan()],
  ...[demo, intercom, sixAndTen, twoSet].map((doc): [string, Plan] => {
    const plan = PlanSchema.parse(doc);
    return [plan.name, plan];
  }),
];

const templatesOf = (kind: string) => TEMPLATES.filter((t) => t.kind === kind).map((t) => t.id);

/** Every port of the plan as a cable end (KSU station ports are jacks named port-1 …). */
function allPorts(plan: Plan): PortRef[] {
  const ksu = Array.from({ length: plan.ksu.ports }, (_, i) => ({
    part: plan.ksu.id,
    port: `port-${i + 1}`,
  }));
  const parts = [...plan.sets, ...plan.addOns, ...plan.adapters];
  return [
    ...ksu,
    ...parts.flatMap((p) =>
      (getTemplate(p.template)?.ports ?? []).map((port) => ({ part: p.id, port: port.name })),
    ),
  ];
}

/** One step chooses its target by index into whatever the plan holds at that point. */
const step = fc.oneof(
  fc.record({ kind: fc.constant('set' as const), t: fc.nat() }),
  fc.record({ kind: fc.constant('adapter' as const), t: fc.nat() }),
  fc.record({ kind: fc.constant('add-on' as const), t: fc.nat(), i: fc.nat() }),
  fc.record({ kind: fc.constant('remove' as const), i: fc.nat() }),
  fc.record({ kind: fc.constant('duplicate' as const), i: fc.nat() }),
  fc.record({ kind: fc.constant('connect' as const), a: fc.nat(), b: fc.nat() }),
  fc.record({ kind: fc.constant('disconnect' as const), i: fc.nat() }),
  fc.record({ kind: fc.constant('station' as const), code: fc.stringMatching(/^[0-9]{1,4}$/) }),
  fc.record({ kind: fc.constant('unstation' as const), i: fc.nat() }),
  fc.record({ kind: fc.constant('assign' as const), i: fc.nat(), s: fc.nat() }),
  fc.record({ kind: fc.constant('serves' as const), i: fc.nat(), s: fc.nat() }),
  fc.record({ kind: fc.constant('template' as const), i: fc.nat(), t: fc.nat() }),
  fc.record({
    kind: fc.constant('ringers' as const),
    i: fc.nat(),
    lines: fc.array(fc.integer({ min: 1, max: 30 })),
  }),
  fc.record({
    kind: fc.constant('lead' as const),
    i: fc.nat(),
    op: fc.constantFrom('lift', 'move', 'restore'),
    pair: fc.integer({ min: 1, max: 25 }),
    to: fc.integer({ min: 1, max: 25 }),
    conductor: fc.constantFrom('tip' as const, 'ring' as const, 'both' as const),
  }),
  fc.record({ kind: fc.constant('lines' as const), n: fc.integer({ min: 0, max: 31 }) }),
  fc.record({ kind: fc.constant('ports' as const), n: fc.integer({ min: 0, max: 25 }) }),
  fc.record({ kind: fc.constant('rename' as const), i: fc.nat(), name: fc.string({ maxLength: 70 }) }),
  fc.record({
    kind: fc.constant('move' as const),
    i: fc.nat(),
    x: fc.double({ noNaN: true, min: -1e6, max: 1e6 }),
  }),
);
type Step = typeof step extends fc.Arbitrary<infer T> ? T : never;

function pick<T>(list: T[], i: number): T | undefined {
  return list.length ? list[i % list.length] : undefined;
}

function apply(plan: Plan, s: Step): edits.EditOutcome {
  const parts = [...plan.sets, ...plan.addOns, ...plan.adapters].map((p) => p.id);
  const leadParts = [...plan.sets, ...plan.addOns].map((p) => p.id);
  const none: edits.EditOutcome = { ok: false, reason: 'nothing to act on' };
  switch (s.kind) {
    case 'set':
      return edits.addSet(plan, pick(templatesOf('set'), s.t) ?? '', at);
    case 'adapter':
      return edits.addAdapter(plan, pick(templatesOf('adapter'), s.t) ?? '', at);
    case 'add-on':
      return edits.addAddOn(plan, pick(templatesOf('add-on'), s.t) ?? '', pick(plan.sets, s.i)?.id ?? '', at);
    case 'remove': {
      const id = pick([plan.ksu.id, ...parts, ...plan.cables.map((c) => c.id)], s.i);
      return id ? edits.removePart(plan, id) : none;
    }
    case 'duplicate': {
      const id = pick(parts, s.i);
      return id ? edits.duplicatePart(plan, id) : none;
    }
    case 'connect': {
      const ports = allPorts(plan);
      const [a, b] = [pick(ports, s.a), pick(ports, s.b)];
      return a && b ? edits.connect(plan, a, b) : none;
    }
    case 'disconnect': {
      const cable = pick(plan.cables, s.i);
      return cable ? edits.removePart(plan, cable.id) : none;
    }
    case 'station':
      return edits.addStation(plan, s.code, 'Desk');
    case 'unstation': {
      const st = pick(plan.ksu.stations, s.i);
      return st ? edits.removeStation(plan, st.id) : none;
    }
    case 'assign': {
      const set = pick(plan.sets, s.i);
      const st = pick([null, ...plan.ksu.stations.map((x) => x.id)], s.s);
      return set ? edits.updateSet(plan, set.id, { station: st ?? null }) : none;
    }
    case 'serves': {
      const addOn = pick(plan.addOns, s.i);
      const set = pick(plan.sets, s.s);
      return addOn && set ? edits.setAddOnServes(plan, addOn.id, set.id) : none;
    }
    case 'template': {
      const set = pick(plan.sets, s.i);
      return set ? edits.updateSet(plan, set.id, { template: pick(templatesOf('set'), s.t) }) : none;
    }
    case 'ringers': {
      const set = pick(plan.sets, s.i);
      return set ? edits.updateSet(plan, set.id, { ringerLines: s.lines }) : none;
    }
    case 'lead': {
      const id = pick(leadParts, s.i);
      if (!id) return none;
      if (s.op === 'lift') return edits.liftLead(plan, id, s.pair, s.conductor);
      if (s.op === 'move') return edits.moveLead(plan, id, s.pair, s.to);
      return edits.restoreLead(plan, id, s.pair);
    }
    case 'lines':
      return edits.setLineCount(plan, s.n);
    case 'ports':
      return edits.setPortCount(plan, s.n);
    case 'rename': {
      const id = pick([plan.ksu.id, ...parts], s.i);
      return id ? edits.renamePart(plan, id, s.name) : none;
    }
    case 'move': {
      const id = pick([plan.ksu.id, ...parts], s.i);
      return id ? edits.moveParts(plan, [{ id, position: { x: s.x, y: -s.x } }]) : none;
    }
  }
}

describe('random tray and canvas edits', () => {
  it.each(STARTS)('keep the %s a plan validatePlan accepts', (_name, start) => {
    expectValid(start);
    fc.assert(
      fc.property(fc.array(step, { maxLength: 40 }), (steps) => {
        let plan = start;
        for (const s of steps) {
          const outcome = apply(plan, s);
          if (outcome.ok) plan = outcome.plan;
          else expect(outcome.reason.length).toBeGreaterThan(0);
          const verdict = validatePlan(JSON.parse(JSON.stringify(plan)));
          if (!verdict.ok)
            throw new Error(`${s.kind}: ${verdict.issues.map((i) => `${i.path} ${i.message}`).join('; ')}`);
        }
      }),
      { numRuns: 60 },
    );
  });
});

describe('splicing an add-on into a set cable', () => {
  it('bridges the add-on between the set and where its cable went, as the demo wires its speaker', () => {
    // The demo plan wires a hands-free unit this way: set cord → unit jack "set", unit cord → adapter jack.
    const plan = accepted(edits.spliceAddOn(twoSetPlan(), 'hands-free-unit', 'front', { x: 400, y: 0 }));
    const addOn = plan.addOns.at(-1);
    expect(addOn?.serves).toBe('front');
    const byId = new Map(plan.cables.map((c) => [c.id, c]));
    // The cable that ran from the front set to the bridge keeps its id and now leaves the add-on's plug.
    expect(byId.get('c-front')?.from).toEqual({ part: addOn?.id, port: 'cord' });
    expect(byId.get('c-front')?.to).toEqual({ part: 'bridge', port: 'jack-1' });
    const setCord = plan.cables.filter((c) => c.from.part === 'front' || c.to.part === 'front');
    expect(setCord).toHaveLength(1);
    expect(setCord[0].to).toEqual({ part: addOn?.id, port: 'set' });
    expect(plan.cables).toHaveLength(4);
    expectValid(plan);
  });

  it('puts the add-on on the cord of a set that has no cable yet', () => {
    const base = accepted(edits.removePart(twoSetPlan(), 'c-back'));
    const plan = accepted(edits.spliceAddOn(base, 'hands-free-unit', 'back', at));
    const id = plan.addOns.at(-1)?.id;
    expect(plan.cables.filter((c) => c.from.part === id || c.to.part === id)).toEqual([
      expect.objectContaining({ from: { part: 'back', port: 'cord' }, to: { part: id, port: 'set' } }),
    ]);
    expectValid(plan);
  });

  it('refuses a set that is not in the plan and leaves the plan unchanged', () => {
    const result = edits.spliceAddOn(twoSetPlan(), 'hands-free-unit', 'nobody', at);
    expect(result.ok).toBe(false);
  });

  it.each(STARTS)('keeps the %s valid when spliced onto every set in turn', (_name, start) => {
    let plan = start;
    for (const set of start.sets) plan = accepted(edits.spliceAddOn(plan, 'hands-free-unit', set.id, at));
    expect(plan.addOns.length).toBe(start.addOns.length + start.sets.length);
    expectValid(plan);
  });
});
