/**
 * Properties over generated plans: random KSU sizes, one to four sets of random templates, adapters, add-ons,
 * cables and states. Each property is a rule of the trade or of the engine's own design, named beside it.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  evaluate,
  findingKey,
  getTemplate,
  initialState,
  sweep,
  validatePlan,
  type Finding,
  type LeadChange,
  type Plan,
  type SimState,
} from '../../shared/engine/index';
import { planBuilder } from '../support/plan-builder';

const SET_TEMPLATES = ['single-line', 'six-key', 'six-key-hf', 'ten-key'] as const;

interface SetShape {
  template: (typeof SET_TEMPLATES)[number];
  addOn: boolean;
  station: number;
}
interface GroupShape {
  adapter: 'bridging-adapter' | 'bridging-adapter-4' | null;
  sets: SetShape[];
}
interface Shape {
  lines: number;
  stations: number;
  groups: GroupShape[];
}

const setShape = fc.record({
  template: fc.constantFrom(...SET_TEMPLATES),
  addOn: fc.boolean(),
  station: fc.integer({ min: 0, max: 3 }),
});

const groupShape: fc.Arbitrary<GroupShape> = fc.oneof(
  fc.record({ adapter: fc.constant(null), sets: fc.array(setShape, { minLength: 1, maxLength: 1 }) }),
  fc.record({
    adapter: fc.constant('bridging-adapter' as const),
    sets: fc.array(setShape, { minLength: 1, maxLength: 2 }),
  }),
  fc.record({
    adapter: fc.constant('bridging-adapter-4' as const),
    sets: fc.array(setShape, { minLength: 1, maxLength: 4 }),
  }),
);

/** Plans with 1–4 sets on up to three station cables. */
const shapes = (maxSets: number): fc.Arbitrary<Shape> =>
  fc
    .record({
      lines: fc.integer({ min: 1, max: 9 }),
      stations: fc.integer({ min: 0, max: 3 }),
      groups: fc.array(groupShape, { minLength: 1, maxLength: 3 }),
    })
    .filter((s) => {
      const n = s.groups.reduce((sum, g) => sum + g.sets.length, 0);
      return n >= 1 && n <= maxSets;
    });

function buildPlan(shape: Shape): Plan {
  const b = planBuilder('Generated');
  const ksu = b.ksu({ lines: shape.lines, stations: shape.stations, ports: 4 });
  let n = 0;
  shape.groups.forEach((g, gi) => {
    const adapter = g.adapter ? b.adapter(g.adapter, `Adapter ${gi + 1}`) : null;
    if (adapter) b.cable(ksu.port(gi + 1), adapter.plug);
    g.sets.forEach((s, si) => {
      n++;
      const station = s.station < shape.stations ? ksu.stations[s.station] : undefined;
      const set = b.set(s.template, `Set ${n}`, { station });
      const target = adapter ? adapter.jack(si + 1) : ksu.port(gi + 1);
      if (s.addOn) {
        const addOn = b.addOn(set, `Speaker ${n}`);
        b.cable(set.cord, addOn.jack);
        b.cable(addOn.cord, target);
      } else {
        b.cable(set.cord, target);
      }
    });
  });
  const checked = validatePlan(b.input());
  if (!checked.ok) throw new Error(JSON.stringify(checked.issues));
  return checked.plan;
}

/** A state drawn for a plan: each set's hookswitch, latched key and hands-free switch. */
function stateFor(plan: Plan, picks: { offHook: boolean; key: number; handsFree: boolean }[]): SimState {
  const state = initialState(plan);
  plan.sets.forEach((set, i) => {
    const pick = picks[i % picks.length];
    const keys = (getTemplate(set.template)?.keys ?? []).filter((k) => k.kind === 'line');
    state.sets[set.id] = {
      offHook: pick.offHook,
      pressedKey: keys.length === 0 || pick.key === 0 ? null : keys[pick.key % keys.length].index,
      handsFreeOn: pick.handsFree && plan.addOns.some((a) => a.serves === set.id),
    };
  });
  return state;
}

const picks = fc.array(
  fc.record({ offHook: fc.boolean(), key: fc.integer({ min: 0, max: 9 }), handsFree: fc.boolean() }),
  { minLength: 4, maxLength: 4 },
);

/** The same plan with every part and cable renamed and every list in another order. */
function renamedAndShuffled(plan: Plan, order: number[]): { plan: Plan; rename: Map<string, string> } {
  const rename = new Map<string, string>();
  const ids = [...plan.sets, ...plan.addOns, ...plan.adapters, ...plan.cables].map((p) => p.id);
  ids.forEach((id, i) => rename.set(id, `z${ids.length - i}-${id}`.slice(0, 40)));
  const r = (id: string) => rename.get(id) ?? id;
  const shuffle = <T>(xs: T[]) =>
    xs
      .map((x, i) => ({ x, k: order[i % order.length] * 1000 + i }))
      .sort((a, b) => a.k - b.k)
      .map((e) => e.x);
  const next: Plan = {
    ...plan,
    sets: shuffle(plan.sets.map((s) => ({ ...s, id: r(s.id), name: `Renamed ${s.name}` }))),
    addOns: shuffle(plan.addOns.map((a) => ({ ...a, id: r(a.id), serves: r(a.serves) }))),
    adapters: shuffle(plan.adapters.map((a) => ({ ...a, id: r(a.id) }))),
    cables: shuffle(
      plan.cables.map((c) => ({
        ...c,
        id: r(c.id),
        from: { ...c.from, part: r(c.from.part) },
        to: { ...c.to, part: r(c.to.part) },
      })),
    ),
    required: { ...plan.required, handsFreeSets: plan.required.handsFreeSets.map(r) },
  };
  return { plan: next, rename };
}

function keysBack(findings: Finding[], rename: Map<string, string>): string[] {
  const back = new Map([...rename].map(([a, b]) => [b, a]));
  return findings.map((f) => findingKey({ ...f, sets: f.sets.map((s) => back.get(s) ?? s) })).sort();
}

describe('properties over generated plans', () => {
  it('findings do not depend on part names or the order parts are listed in', () => {
    // Engine design rule (pure function of the wiring), no published source.
    fc.assert(
      fc.property(
        shapes(4),
        picks,
        fc.array(fc.nat(7), { minLength: 5, maxLength: 5 }),
        (shape, p, order) => {
          const plan = buildPlan(shape);
          const { plan: other, rename } = renamedAndShuffled(plan, order);
          const state = stateFor(plan, p);
          const otherState: SimState = {
            ...state,
            sets: Object.fromEntries(Object.entries(state.sets).map(([id, s]) => [rename.get(id) ?? id, s])),
          };
          const a = evaluate(plan, state).findings.map(findingKey).sort();
          const b = keysBack(evaluate(other, otherState).findings, rename);
          expect(b).toEqual(a);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('a sweep finds the same faults whatever the names and order', () => {
    fc.assert(
      fc.property(shapes(2), fc.array(fc.nat(7), { minLength: 5, maxLength: 5 }), (shape, order) => {
        const plan = buildPlan(shape);
        const { plan: other, rename } = renamedAndShuffled(plan, order);
        const a = sweep(plan)
          .findings.map((f) => findingKey(f.finding))
          .sort();
        const b = keysBack(
          sweep(other).findings.map((f) => f.finding),
          rename,
        );
        expect(b).toEqual(a);
      }),
      { numRuns: 6 },
    );
  }, 60_000);

  it('lifting a lead never joins lines that were not joined before', () => {
    // Lifting a lead only removes a conductor, so it can only split nets: common practice, no published source.
    const lift = fc.record({
      part: fc.nat(),
      pair: fc.integer({ min: 1, max: 25 }),
      conductor: fc.constantFrom('both', 'tip', 'ring') as fc.Arbitrary<'both' | 'tip' | 'ring'>,
    });
    fc.assert(
      fc.property(shapes(4), picks, fc.array(lift, { minLength: 1, maxLength: 3 }), (shape, p, lifts) => {
        const plan = buildPlan(shape);
        const state = stateFor(plan, p);
        const parts = [...plan.sets, ...plan.addOns];
        const lifted: Plan = JSON.parse(JSON.stringify(plan));
        for (const l of lifts) {
          const id = parts[l.part % parts.length].id;
          const target = lifted.sets.find((s) => s.id === id) ?? lifted.addOns.find((a) => a.id === id)!;
          const change: LeadChange = { kind: 'lift', pair: l.pair, conductor: l.conductor };
          target.leadChanges.push(change);
        }
        const before = evaluate(plan, state);
        const after = evaluate(lifted, state);
        for (const line of after.lines) {
          const was = before.lines.find((x) => x.line === line.line)!;
          for (const other of line.joinedWith) expect(was.joinedWith).toContain(other);
        }
        for (const f of after.findings.filter((x) => x.code === 'LINES_JOINED')) {
          const covered = before.findings.some(
            (g) => g.code === 'LINES_JOINED' && f.lines.every((n) => g.lines.includes(n)),
          );
          expect(covered, f.message).toBe(true);
        }
      }),
      { numRuns: 80 },
    );
  });

  it('one set alone on its own cable shows no finding in any state', () => {
    // A set by itself on a station cable, with no more KSU lines than line keys, is the installation the station
    // plan is made for: common practice, no published source. (A KSU with more lines puts lines 6–9 on pairs
    // 22–25, where a set wired for hands-free has its own leads: a real conflict, covered by the examples.)
    const alone = setShape.chain((set) => {
      const keys = (getTemplate(set.template)?.keys ?? []).filter((k) => k.kind === 'line').length;
      return fc.record({
        lines: fc.integer({ min: 1, max: Math.max(1, keys) }),
        stations: fc.integer({ min: 0, max: 3 }),
        port: fc.integer({ min: 1, max: 4 }),
        set: fc.constant(set),
      });
    });
    fc.assert(
      fc.property(alone, ({ lines, stations, port, set }) => {
        const b = planBuilder('Alone');
        const ksu = b.ksu({ lines, stations, ports: 4 });
        // The standard station plan feeds port p's buzzer pair from the p-th station: the set answers that one.
        const station = ksu.stations[port - 1];
        const s = b.set(set.template, 'Alone', { station });
        if (set.addOn && set.template === 'six-key-hf') {
          const addOn = b.addOn(s, 'Speaker');
          b.cable(s.cord, addOn.jack);
          b.cable(addOn.cord, ksu.port(port));
        } else {
          b.cable(s.cord, ksu.port(port));
        }
        const result = sweep(b.build());
        expect(result.complete).toBe(true);
        expect(result.findings.map((f) => f.finding.message)).toEqual([]);
      }),
      { numRuns: 30 },
    );
  });
});
