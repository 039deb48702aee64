/** Each finding code with a case that raises it and a close case that must not (common practice, no published source). */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  computeNets,
  evaluate,
  evaluateFindings,
  evaluateWithNets,
  FINDING_CODES,
} from '../../shared/engine/index';
import { operate, planBuilder, setsOnOneCable } from '../support/plan-builder';

const hf = () => setsOnOneCable(['six-key-hf', 'six-key-hf'], { names: ['Front counter', 'Workroom'] });
const plain = () => setsOnOneCable(['six-key', 'six-key'], { names: ['Front counter', 'Workroom'] });

describe('LINES_JOINED', () => {
  it('is raised when different keys on two hands-free wired sets bridge two lines, with the path named', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 1 },
        { kind: 'press-key', set: b, key: 5 },
      ]),
    );
    expect(ev).toHaveFinding('LINES_JOINED', { lines: [1, 5], sets: [a, b], severity: 'fault' });
    const f = ev.findings.find((x) => x.code === 'LINES_JOINED')!;
    expect(f.message).toContain(
      "Front counter's talk pair (CT) on pair 23 (violet-green) is bridged to Workroom's",
    );
    expect(f.path[0].text).toContain('line 1 tip');
    expect(f.path[f.path.length - 1].text).toContain('line 5 tip');
    const pair23 = f.path.filter((h) => h.pair === 23);
    expect(pair23.length).toBeGreaterThan(0);
    expect(pair23.every((h) => h.colour === 'violet-green' && h.conductor === 'tip')).toBe(true); // ICEA S-80-576
    expect(pair23.filter((h) => h.pin !== undefined).every((h) => h.pin === 48)).toBe(true); // RJ21X: tip of pair 23 on pin 23+25
    expect(f.path).toContainEqual(
      expect.objectContaining({ part: a, terminal: 'CT', designation: 'CT', pair: 23, conductor: 'tip' }),
    );
    expect(f.path.some((h) => h.cable !== undefined)).toBe(true);
  });

  it('is not raised for the same keys on sets without the hands-free wiring', () => {
    const { plan, a, b } = plain();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 1 },
        { kind: 'press-key', set: b, key: 5 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    expect(ev.findings).toEqual([]);
  });
});

describe('SET_HEARS_SEVERAL_LINES', () => {
  it('is raised for the set that hears two lines', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 2 },
        { kind: 'press-key', set: b, key: 4 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    expect(ev).toHaveFinding('SET_HEARS_SEVERAL_LINES', { sets: [b], lines: [2, 4] });
    expect(ev).not.toHaveFinding('SET_HEARS_SEVERAL_LINES', { sets: [a] });
  });

  it('is not raised for a set alone on one line', () => {
    const { plan, b } = hf();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: b, key: 4 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    expect(ev).not.toHaveFinding('SET_HEARS_SEVERAL_LINES');
  });
});

describe('SET_HEARS_UNSELECTED_LINE', () => {
  it('is raised when an off-hook set with no key down hears the other set’s line', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 3 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    expect(ev).toHaveFinding('SET_HEARS_UNSELECTED_LINE', { sets: [b], lines: [3] });
    expect(ev.findings.find((f) => f.code === 'SET_HEARS_UNSELECTED_LINE')!.message).toContain(
      'no line key down',
    );
  });

  it('is not raised when the sets are not wired for hands-free', () => {
    const { plan, a, b } = plain();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 3 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    expect(ev).not.toHaveFinding('SET_HEARS_UNSELECTED_LINE');
  });
});

describe('LINE_LIT_UNATTENDED', () => {
  it('is raised for a line grounded by another set’s hookswitch', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(
      plan,
      operate(plan, [
        { kind: 'press-key', set: a, key: 1 },
        { kind: 'press-key', set: b, key: 5 },
        { kind: 'lift-handset', set: b },
      ]),
    );
    expect(ev).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [1], sets: [a] });
    expect(ev).not.toHaveFinding('LINE_LIT_UNATTENDED', { lines: [5] });
    const f = ev.findings.find((x) => x.code === 'LINE_LIT_UNATTENDED')!;
    expect(f.path[0].text).toContain('line 1 A-lead');
    expect(f.path[f.path.length - 1].text).toContain('ground');
  });

  it('is raised when hold on one line leaves the other set’s latched line lit', () => {
    const { plan, a, b } = hf();
    const state = operate(plan, [
      { kind: 'press-key', set: a, key: 1 },
      { kind: 'press-key', set: b, key: 5 },
      { kind: 'lift-handset', set: b },
      { kind: 'press-hold', set: b },
    ]);
    const ev = evaluate(plan, state);
    // Line 5 holds; line 1 stays grounded through the shared A-lead common and the holder's hookswitch.
    expect(ev.lines[4].status).toBe('held');
    expect(ev.lines[0].status).toBe('in-use');
    expect(ev).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [1] });
    expect(ev).not.toHaveFinding('LINE_LIT_UNATTENDED', { lines: [5] });
  });

  it('is raised for a line held aside, as a sweep may present it', () => {
    const { plan } = hf();
    const state = operate(plan, []);
    state.lines[1] = { ...state.lines[1], circuit: 'held', heldWithoutSelection: true };
    expect(evaluate(plan, state)).toHaveFinding('LINE_LIT_UNATTENDED', { lines: [2] });
    state.lines[1].heldWithoutSelection = false;
    expect(evaluate(plan, state)).not.toHaveFinding('LINE_LIT_UNATTENDED');
  });

  it('is not raised for an ordinary held line or a line in use', () => {
    const { plan, b } = hf();
    const talking = operate(plan, [
      { kind: 'press-key', set: b, key: 5 },
      { kind: 'lift-handset', set: b },
    ]);
    expect(evaluate(plan, talking)).not.toHaveFinding('LINE_LIT_UNATTENDED');
    const held = operate(plan, [{ kind: 'press-hold', set: b }], talking);
    expect(evaluate(plan, held).lines[4].status).toBe('held');
    expect(evaluate(plan, held)).not.toHaveFinding('LINE_LIT_UNATTENDED');
  });
});

describe('BREAK_IN', () => {
  const call = (plan: ReturnType<typeof hf>['plan'], a: string) =>
    operate(plan, [
      { kind: 'press-key', set: a, key: 2 },
      { kind: 'lift-handset', set: a },
      { kind: 'dial', set: a, digits: '5557788' },
      { kind: 'far-answer', line: 2 },
      { kind: 'ring-line', line: 4 },
    ]);

  it('is raised when a set hears a call in progress through another key', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(
      plan,
      operate(
        plan,
        [
          { kind: 'press-key', set: b, key: 4 },
          { kind: 'lift-handset', set: b },
        ],
        call(plan, a),
      ),
    );
    expect(ev).toHaveFinding('BREAK_IN', { sets: [b, a], lines: [2] });
    expect(ev).toHaveFinding('BREAK_IN', { sets: [a, b], lines: [4] });
    expect(ev.findings.find((f) => f.code === 'BREAK_IN')!.message).toContain('and the far party');
  });

  it('is not raised when the second set picks up the same line', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(
      plan,
      operate(
        plan,
        [
          { kind: 'press-key', set: b, key: 2 },
          { kind: 'lift-handset', set: b },
        ],
        call(plan, a),
      ),
    );
    expect(ev).not.toHaveFinding('BREAK_IN');
    expect(ev.findings.filter((f) => f.code !== 'PRIVATE_LEAD_SHARED')).toEqual([]);
  });
});

describe('INTERCOM_SOUNDS_SEVERAL', () => {
  it('is raised when a call to one station sounds a set assigned to another', () => {
    const { plan, a, b } = setsOnOneCable(['six-key', 'six-key'], {
      sets: [{ station: 'st-21' }, { station: 'st-22' }],
    });
    const ev = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-21' }]));
    expect(ev).toHaveFinding('INTERCOM_SOUNDS_SEVERAL', { stations: ['st-21'], sets: [a, b] });
    const f = ev.findings.find((x) => x.code === 'INTERCOM_SOUNDS_SEVERAL')!;
    expect(f.message).toContain('pair 18 (yellow-green)'); // ICEA S-80-576
    expect(ev.stations.find((s) => s.station === 'st-21')!.buzzing).toEqual([a, b]);
  });

  it('is not raised when every set that sounds is assigned to the station called', () => {
    const { plan } = setsOnOneCable(['six-key', 'six-key'], {
      sets: [{ station: 'st-21' }, { station: 'st-21' }],
    });
    const ev = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-21' }]));
    expect(ev.sets.map((s) => s.buzzer)).toEqual([true, true]);
    expect(ev).not.toHaveFinding('INTERCOM_SOUNDS_SEVERAL');
  });

  it('is not raised for one unassigned set alone on a port', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 2, stations: 1 });
    const x = b.set('six-key', 'Alone');
    b.cable(ksu.port(1), x.cord);
    const plan = b.build();
    const ev = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-21' }]));
    expect(ev.sets[0].buzzer).toBe(true);
    expect(ev).not.toHaveFinding('INTERCOM_SOUNDS_SEVERAL');
  });

  it('is raised for one set that answers a station other than the one called', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 2, stations: 2 });
    const x = b.set('six-key', 'Stockroom', { station: 'st-22' });
    b.cable(ksu.port(1), x.cord);
    const plan = b.build();
    const ev = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-21' }]));
    expect(ev).toHaveFinding('INTERCOM_SOUNDS_SEVERAL', { sets: [x.id], stations: ['st-21'] });
    expect(ev.findings[0].message).toBe(
      'An intercom call to station 21 buzzes Stockroom, though Stockroom answers station 22 on pair 18 (yellow-green).', // ICEA S-80-576
    );
  });

  it('is not raised for sets on their own station ports', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 2, stations: 2 });
    const x = b.set('six-key', 'Office', { station: 'st-21' });
    const y = b.set('six-key', 'Stockroom', { station: 'st-22' });
    b.cable(ksu.port(1), x.cord);
    b.cable(ksu.port(2), y.cord);
    const plan = b.build();
    const ev = evaluate(plan, operate(plan, [{ kind: 'intercom-call', station: 'st-22' }]));
    expect(ev.sets.map((s) => s.buzzer)).toEqual([false, true]);
    expect(ev.findings).toEqual([]);
  });
});

describe('PRIVATE_LEAD_SHARED', () => {
  it('is raised in every state when two sets’ own leads are paralleled', () => {
    const { plan, a, b } = hf();
    const ev = evaluate(plan, operate(plan, []));
    expect(ev).toHaveFinding('PRIVATE_LEAD_SHARED', { sets: [a, b], severity: 'warning' });
    expect(ev.findings.find((f) => f.code === 'PRIVATE_LEAD_SHARED')!.message).toContain(
      'pairs 23 (violet-green), 24 (violet-brown), 25 (violet-slate)', // ICEA S-80-576
    );
  });

  it('is not raised between a set and its own add-on, nor beside a set without the wiring', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5 });
    const set = b.set('six-key-hf', 'Front');
    const other = b.set('six-key', 'Back');
    const unit = b.addOn(set);
    const ad = b.adapter();
    b.cable(ksu.port(1), ad.plug);
    b.cable(ad.jack(1), unit.cord);
    b.cable(unit.jack, set.cord);
    b.cable(ad.jack(2), other.cord);
    const plan = b.build();
    expect(evaluate(plan, operate(plan, [])).findings).toEqual([]);
  });
});

describe('findings in general', () => {
  it('cover exactly the codes the API contract publishes, in its order', () => {
    const contract = readFileSync(new URL('../../shared/engine/api-contract.md', import.meta.url), 'utf8');
    const union = /^FindingCode = ([\s\S]*?)^Hop = /m.exec(contract)?.[1] ?? '';
    const published = [...union.matchAll(/'([A-Z_]+)'/g)].map((m) => m[1]);
    expect(published.length).toBeGreaterThan(0);
    expect(FINDING_CODES).toEqual(published);
  });

  it('are the same with and without paths, and with nets computed once', () => {
    const { plan, a, b } = hf();
    const state = operate(plan, [
      { kind: 'press-key', set: a, key: 1 },
      { kind: 'lift-handset', set: a },
      { kind: 'press-key', set: b, key: 5 },
      { kind: 'lift-handset', set: b },
      { kind: 'intercom-call', station: 'st-21' },
    ]);
    const full = evaluate(plan, state);
    const quick = evaluate(plan, state, { paths: false });
    const brief = (fs: typeof full.findings) => fs.map((f) => [f.code, f.sets, f.lines, f.stations]);
    expect(brief(quick.findings)).toEqual(brief(full.findings));
    expect(quick.findings.every((f) => f.path.length === 0)).toBe(true);
    expect(full.findings.every((f) => f.message.length > 20)).toBe(true);
    const nets = computeNets(plan, state);
    expect(evaluateWithNets(plan, state, nets)).toEqual(full);
    expect(evaluateFindings(plan, state, nets)).toEqual(quick.findings);
    const ringing = { ...state, lines: state.lines.map((l) => (l.line === 3 ? { ...l, ringing: true } : l)) };
    expect(evaluateWithNets(plan, ringing, nets)).toEqual(evaluate(plan, ringing));
  });
});

describe('finding paths', () => {
  it('run from the first to the last terminal without visiting any terminal twice', () => {
    const { plan, a, b } = hf();
    const state = operate(plan, [
      { kind: 'press-key', set: a, key: 2 },
      { kind: 'lift-handset', set: a },
      { kind: 'press-key', set: b, key: 4 },
      { kind: 'lift-handset', set: b },
      { kind: 'intercom-call', station: 'st-22' },
    ]);
    const ev = evaluate(plan, state);
    expect(ev.findings.length).toBeGreaterThan(4);
    for (const f of ev.findings) {
      expect(f.path.length, f.code).toBeGreaterThan(1);
      const places = f.path.map((h) => `${h.part}|${h.port ?? ''}|${h.pin ?? ''}|${h.terminal ?? ''}`);
      expect(new Set(places).size, f.code).toBe(places.length);
      expect(
        f.path.slice(1).every((h) => h.text.includes(' — via ')),
        f.code,
      ).toBe(true);
    }
  });
});
