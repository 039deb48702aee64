/**
 * The shipped example plans and helpers. Check values: colours ICEA S-80-576; pair plan our own scheme
 * (shared/engine/templates/README.md); scenario behaviour common practice, no published source.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  evaluate,
  leadTable,
  SimStateSchema,
  standardCrossConnect,
  validatePlan,
  type Plan,
} from '../../shared/engine/index';
import { LIFT_LAST_THREE_PAIRS, setsOnOneCable } from '../support/plan-builder';

const dir = join(__dirname, '../../shared/engine/examples');
const load = (file: string): unknown => JSON.parse(readFileSync(join(dir, file), 'utf8'));
function plan(file: string): Plan {
  const r = validatePlan(load(file));
  if (!r.ok) throw new Error(`${file}: ${JSON.stringify(r.issues)}`);
  return r.plan;
}

describe('example plans', () => {
  it.each(['demo-plan.json', 'two-set.json', 'intercom.json', 'six-and-ten.json'])(
    '%s is a valid plan',
    (file) => {
      expect(validatePlan(load(file)).ok).toBe(true);
    },
  );

  it('place every part on the canvas, the KSU leftmost', () => {
    for (const file of ['demo-plan.json', 'two-set.json', 'intercom.json', 'six-and-ten.json']) {
      const p = plan(file);
      const parts = [...p.sets, ...p.addOns, ...p.adapters];
      expect(
        parts.every((x) => x.position !== undefined),
        file,
      ).toBe(true);
      expect(Math.min(...parts.map((x) => x.position!.x))).toBeGreaterThan(p.ksu.position!.x);
    }
  });

  it('every example state fits its plan', () => {
    for (const file of readdirSync(join(dir, 'states'))) {
      const state = SimStateSchema.parse(load(`states/${file}`));
      const planFile = file.startsWith('demo')
        ? 'demo-plan.json'
        : file.startsWith('two-set')
          ? 'two-set.json'
          : 'six-and-ten.json';
      const p = plan(planFile);
      expect(Object.keys(state.sets).sort(), file).toEqual(p.sets.map((s) => s.id).sort());
      expect(() => evaluate(p, state)).not.toThrow();
    }
  });

  it('the demo shows the joined lines of its shared cable', () => {
    const p = plan('demo-plan.json');
    const state = SimStateSchema.parse(load('states/demo-line-lit.json'));
    const ev = evaluate(p, state);
    expect(ev).toHaveFinding('LINES_JOINED', { lines: [1, 5] });
    expect(ev).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [1], sets: ['front-counter'] });
    const intercom = evaluate(p, SimStateSchema.parse(load('states/demo-intercom.json')));
    expect(intercom).toHaveFinding('INTERCOM_SOUNDS_SEVERAL', { stations: ['st-21'] });
  });
});

describe('standard cross-connect', () => {
  it('gives each port three pairs per line up to five lines and pair 18 to the port’s station', () => {
    const cc = standardCrossConnect({
      lines: [1, 2].map((n) => ({ number: n, label: '', directoryNumber: `555000${n}` })),
      stations: [{ id: 'st-21', code: '21', label: '' }],
      ports: 2,
    });
    expect(cc.filter((c) => c.port === 1)).toEqual([
      { port: 1, pair: 1, lead: { kind: 'line-talk', line: 1 } }, // our own pair plan, templates/README.md
      { port: 1, pair: 2, lead: { kind: 'line-a', line: 1 } },
      { port: 1, pair: 3, lead: { kind: 'line-lamp', line: 1 } },
      { port: 1, pair: 4, lead: { kind: 'line-talk', line: 2 } },
      { port: 1, pair: 5, lead: { kind: 'line-a', line: 2 } },
      { port: 1, pair: 6, lead: { kind: 'line-lamp', line: 2 } },
      { port: 1, pair: 18, lead: { kind: 'buzzer', station: 'st-21' } },
    ]);
    expect(cc.filter((c) => c.port === 2).some((c) => c.lead.kind === 'buzzer')).toBe(false); // no second station
  });

  it('uses our own scheme for lines 6–9', () => {
    const cc = standardCrossConnect({
      lines: Array.from({ length: 9 }, (_, i) => ({
        number: i + 1,
        label: '',
        directoryNumber: `55500${10 + i}`,
      })),
      stations: [],
      ports: 1,
    });
    expect(cc.filter((c) => c.lead.kind !== 'buzzer' && c.lead.line === 7)).toEqual([
      { port: 1, pair: 19, lead: { kind: 'line-talk', line: 7 } }, // our own scheme, templates/README.md
      { port: 1, pair: 23, lead: { kind: 'line-a-lamp', line: 7 } }, // our own scheme
    ]);
  });
});

describe('lead table', () => {
  it('lists the 25 pairs of a set with colours, designations and state', () => {
    const { plan: p, a } = setsOnOneCable(['six-key-hf', 'six-key'], {
      sets: [
        { leadChanges: [...LIFT_LAST_THREE_PAIRS.slice(0, 2), { kind: 'move', pair: 18, toPair: 17 }] },
        {},
      ],
    });
    const rows = leadTable(p, a);
    expect(rows).toHaveLength(25);
    expect(rows[0]).toMatchObject({
      pair: 1,
      colourName: 'white-blue',
      designationTip: 'L1 T',
      designationRing: 'L1 R',
      scope: 'bus',
      state: 'connected',
    }); // ICEA S-80-576
    expect(rows[16]).toMatchObject({
      pair: 17,
      colourName: 'yellow-orange',
      state: 'spare',
      movedFrom: [18],
    }); // ICEA S-80-576
    expect(rows[17]).toMatchObject({
      pair: 18,
      colourName: 'yellow-green',
      state: 'moved',
      movedTo: 17,
      scope: 'station',
    }); // ICEA S-80-576
    expect(rows[22]).toMatchObject({
      pair: 23,
      colourName: 'violet-green',
      state: 'lifted',
      scope: 'private',
    }); // ICEA S-80-576
    expect(rows[24]).toMatchObject({ pair: 25, designationTip: 'AC', state: 'connected' });
    expect(leadTable(p, 'nothing')).toEqual([]);
  });
});
