/**
 * Part templates and the pair plan. Check values: colours ICEA S-80-576, pins USOC RJ21X (47 CFR Part 68 Subpart F);
 * pair assignments are our own scheme (shared/engine/templates/README.md); key-set behaviour is common practice,
 * no published source.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  createMech,
  evaluateNets,
  fillMech,
  getNetlist,
  getTemplate,
  initialState,
  pairColour,
  pinOf,
  TEMPLATES,
  type Plan,
  type SimState,
} from '../../shared/engine/index';
import { planBuilder } from '../support/plan-builder';

/** Are two terminals (part id, terminal name or "port:pin") on one net in this state? */
function sameNet(plan: Plan, state: SimState, x: [string, string], y: [string, string]): boolean {
  const nl = getNetlist(plan);
  const id = ([part, name]: [string, string]) => {
    const t = nl.terminalIndex.get(`${nl.partById.get(part)!.index}|${name}`);
    if (t === undefined) throw new Error(`no terminal ${part} ${name}`);
    return t;
  };
  const roots = evaluateNets(nl, fillMech(nl, state, createMech(nl)));
  const [a, b] = [id(x), id(y)];
  if (nl.dense[a] >= 0 && nl.dense[b] >= 0) return roots[nl.dense[a]] === roots[nl.dense[b]];
  return nl.staticRoot[a] === nl.staticRoot[b];
}

function leadsOnPair(templateId: string, pair: number) {
  return getTemplate(templateId)!.leads.filter((l) => l.pair === pair);
}

describe('part templates', () => {
  it('ship every part kind: sets, an add-on, adapters and the KSU', () => {
    const kinds = new Set(TEMPLATES.map((t) => t.kind));
    expect([...kinds].sort()).toEqual(['adapter', 'add-on', 'ksu', 'set']);
    for (const id of [
      'single-line',
      'six-key',
      'six-key-hf',
      'ten-key',
      'hands-free-unit',
      'bridging-adapter',
      'ksu',
    ]) {
      expect(getTemplate(id), id).toBeDefined();
    }
    expect(getTemplate('no-such-part')).toBeUndefined();
  });

  it('give every template unique ids, and every lead a terminal, purpose and scope', () => {
    expect(new Set(TEMPLATES.map((t) => t.id)).size).toBe(TEMPLATES.length);
    for (const t of TEMPLATES) {
      const seen = new Set<string>();
      for (const l of t.leads) {
        expect(l.terminal, `${t.id} pair ${l.pair}`).not.toBe('');
        expect(l.purpose).not.toBe('');
        expect(['bus', 'station', 'private']).toContain(l.scope);
        const key = `${l.pair}${l.conductor}`;
        expect(seen.has(key), `${t.id}: two leads on pair ${l.pair} ${l.conductor}`).toBe(false);
        seen.add(key);
      }
    }
  });

  it('number a six-key set 1–5 for the line keys and 6 for hold', () => {
    const keys = getTemplate('six-key')!.keys!;
    expect(keys.map((k) => [k.index, k.kind, k.line ?? null])).toEqual([
      [1, 'line', 1],
      [2, 'line', 2],
      [3, 'line', 3],
      [4, 'line', 4],
      [5, 'line', 5],
      [6, 'hold', null],
    ]); // common practice, no published source: five line keys and a hold key
    expect(getTemplate('ten-key')!.keys!.filter((k) => k.kind === 'line')).toHaveLength(9); // nine lines and hold
  });

  it('put line k of a six-key set on pairs 3k-2 (T/R), 3k-1 (A/A1) and 3k (L/LG)', () => {
    for (let k = 1; k <= 5; k++) {
      expect(leadsOnPair('six-key', 3 * k - 2).map((l) => l.designation)).toEqual([`L${k} T`, `L${k} R`]); // our own pair plan, templates/README.md
      expect(leadsOnPair('six-key', 3 * k - 1).map((l) => l.designation)).toEqual([`L${k} A`, `L${k} A1`]); // our own pair plan
      expect(leadsOnPair('six-key', 3 * k).map((l) => l.designation)).toEqual([`L${k} L`, `L${k} LG`]); // our own pair plan
    }
  });

  it('put the buzzer on pair 18 and leave pair 17 spare', () => {
    expect(leadsOnPair('six-key', 18).map((l) => l.scope)).toEqual(['station', 'station']);
    expect(pairColour(18).name).toBe('yellow-green'); // ICEA S-80-576
    expect(leadsOnPair('six-key', 17)).toEqual([]);
    expect(pairColour(17).name).toBe('yellow-orange'); // ICEA S-80-576
    for (let pair = 19; pair <= 25; pair++) expect(leadsOnPair('six-key', pair), `pair ${pair}`).toEqual([]);
  });

  it('brings the hands-free circuits of a six-key set out on pairs 23, 24 and 25', () => {
    const talk = leadsOnPair('six-key-hf', 23);
    const mute = leadsOnPair('six-key-hf', 24);
    const aControl = leadsOnPair('six-key-hf', 25);
    expect(talk.map((l) => l.designation)).toEqual(['CT', 'CR']);
    expect(talk.every((l) => l.role === 'talk pair' && l.scope === 'private')).toBe(true);
    expect(mute.every((l) => l.role === 'mute lead' && l.scope === 'private')).toBe(true);
    expect(aControl.map((l) => l.designation)).toEqual(['AC', 'A1']);
    expect(aControl.every((l) => l.role === 'A-lead control' && l.scope === 'private')).toBe(true);
    expect([23, 24, 25].map((p) => pairColour(p).name)).toEqual([
      'violet-green',
      'violet-brown',
      'violet-slate',
    ]); // ICEA S-80-576
  });

  it('switches the common talk pair on pair 23 through the latched line key', () => {
    const b = planBuilder();
    const ksu = b.ksu({ lines: 5 });
    const set = b.set('six-key-hf', 'Front');
    b.cable(ksu.port(1), set.cord);
    const plan = b.build();
    const state = initialState(plan);
    const line3Tip: [string, string] = ['front', `cord:${pinOf(7, 'tip')}`];
    const pair23Tip: [string, string] = ['front', `cord:${pinOf(23, 'tip')}`];
    const pair25Tip: [string, string] = ['front', `cord:${pinOf(25, 'tip')}`];
    const line3A: [string, string] = ['front', `cord:${pinOf(8, 'tip')}`];
    expect(sameNet(plan, state, line3Tip, pair23Tip)).toBe(false);
    state.sets.front.pressedKey = 3;
    expect(sameNet(plan, state, line3Tip, pair23Tip)).toBe(true);
    expect(sameNet(plan, state, line3A, pair25Tip)).toBe(true);
    state.sets.front.pressedKey = 2;
    expect(sameNet(plan, state, line3Tip, pair23Tip)).toBe(false);
  });

  it('wires lines 6–9 of the ten-key set on pairs 16, 19–21 and A/lamp leads on 22–25 (our own scheme)', () => {
    expect(leadsOnPair('ten-key', 16).map((l) => l.designation)).toEqual(['L6 T', 'L6 R']); // our own scheme, templates/README.md
    expect(leadsOnPair('ten-key', 21).map((l) => l.designation)).toEqual(['L9 T', 'L9 R']); // our own scheme
    for (let k = 6; k <= 9; k++) {
      expect(leadsOnPair('ten-key', 16 + k).map((l) => l.designation)).toEqual([`L${k} A`, `L${k} L`]); // our own scheme
    }
    const springs = getTemplate('ten-key')!.contacts.filter(
      (c) => typeof c.when === 'object' && c.when.key === 7,
    );
    expect(springs.map((c) => c.b)).toContain('L7.A');
  });

  it('gives the bridging adapter two jacks and one plug', () => {
    const ports = getTemplate('bridging-adapter')!.ports;
    expect(ports.filter((p) => p.gender === 'jack')).toHaveLength(2);
    expect(ports.filter((p) => p.gender === 'plug')).toHaveLength(1);
  });

  it('parallels every pin of the adapter plug and both jacks, and nothing else', () => {
    const b = planBuilder();
    b.ksu({ lines: 1 });
    const ad = b.adapter();
    const plan = b.build();
    const state = initialState(plan);
    for (let pin = 1; pin <= 50; pin++) {
      expect(sameNet(plan, state, [ad.id, `plug:${pin}`], [ad.id, `jack-1:${pin}`]), `pin ${pin}`).toBe(true);
      expect(sameNet(plan, state, [ad.id, `plug:${pin}`], [ad.id, `jack-2:${pin}`]), `pin ${pin}`).toBe(true);
    }
    expect(sameNet(plan, state, [ad.id, 'plug:1'], [ad.id, 'jack-1:2'])).toBe(false);
    expect(sameNet(plan, state, [ad.id, 'plug:1'], [ad.id, 'jack-2:26'])).toBe(false);
  });

  it('passes every pin of the hands-free add-on plug through to its jack', () => {
    const tpl = getTemplate('hands-free-unit')!;
    expect(tpl.kind).toBe('add-on');
    expect(tpl.bridges).toEqual([['cord', 'set']]);
    expect(tpl.leads.map((l) => l.pair).every((p) => p >= 23)).toBe(true);
  });

  it('keeps a single-line set on line 1 without line keys', () => {
    const tpl = getTemplate('single-line')!;
    expect(tpl.keys).toEqual([]);
    expect(tpl.fixedLines).toEqual([1]);
    expect(tpl.leads.map((l) => l.pair)).toEqual([1, 1, 2, 2]);
  });
});

describe('engine code outside templates/', () => {
  it('never names a particular template', () => {
    const root = join(__dirname, '../../shared/engine');
    const ids = TEMPLATES.map((t) => t.id).filter((id) => id !== 'ksu');
    const offenders: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const path = join(dir, name);
        if (statSync(path).isDirectory()) {
          if (!['templates', 'examples'].includes(name)) walk(path);
        } else if (name.endsWith('.ts')) {
          const text = readFileSync(path, 'utf8');
          for (const id of ids) if (text.includes(`'${id}'`)) offenders.push(`${path}: ${id}`);
        }
      }
    };
    walk(root);
    expect(offenders).toEqual([]);
  });
});
