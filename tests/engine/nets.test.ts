/**
 * The per-state nets (static components + closed contacts) against a plain union-find over every wire and every
 * closed contact, for random key, hookswitch, hold and hands-free states. Check values come from that second
 * computation, not from memory.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  createMech,
  evaluateNets,
  getNetlist,
  validatePlan,
  type Mech,
  type Netlist,
  type Plan,
} from '../../shared/engine/index';
import { isContactClosed } from '../../shared/engine/model/nets';

function examplePlan(file: string): Plan {
  const r = validatePlan(
    JSON.parse(readFileSync(join(__dirname, '../../shared/engine/examples', file), 'utf8')),
  );
  if (!r.ok) throw new Error(file);
  return r.plan;
}

function plainNets(nl: Netlist, mech: Mech): (t: number) => number {
  const parent = Array.from(nl.terminals, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x])));
  for (const e of nl.edges) {
    if (e.kind === 'contact' && !isContactClosed(nl.contacts[e.contact!], mech)) continue;
    parent[find(e.a)] = find(e.b);
  }
  return find;
}

const setState = fc.record({
  offHook: fc.boolean(),
  key: fc.integer({ min: 0, max: 10 }),
  hold: fc.boolean(),
  handsFree: fc.boolean(),
});

describe.each(['demo-plan.json', 'six-and-ten.json', 'intercom.json'])('nets of %s', (file) => {
  const plan = examplePlan(file);
  const nl = getNetlist(plan);
  const watched = [
    nl.gnd,
    ...nl.lines.flatMap((l) => [l.t, l.r, l.a, l.l]),
    ...nl.stations.flatMap((s) => [s.t, s.r]),
  ];
  for (const e of nl.elements) watched.push(e.a, e.b);

  it('match a plain union-find in every state tried', () => {
    fc.assert(
      fc.property(fc.array(setState, { minLength: nl.sets.length, maxLength: nl.sets.length }), (states) => {
        const mech = createMech(nl);
        states.forEach((s, i) => {
          mech.offHook[i] = s.offHook ? 1 : 0;
          mech.pressedKey[i] = s.key;
          mech.holdDown[i] = s.hold ? 1 : 0;
          mech.handsFreeOn[i] = s.handsFree ? 1 : 0;
        });
        const roots = evaluateNets(nl, mech);
        const plain = plainNets(nl, mech);
        for (const x of watched) {
          for (const y of watched) {
            const fast = roots[nl.dense[x]] === roots[nl.dense[y]];
            if (fast !== (plain(x) === plain(y))) return false;
          }
        }
        return true;
      }),
      { numRuns: 60 },
    );
  });

  it('change with the state (the comparison above is not vacuous)', () => {
    const mech = createMech(nl);
    const idle = evaluateNets(nl, mech).slice();
    mech.offHook[0] = 1;
    mech.pressedKey[0] = 1;
    const busy = evaluateNets(nl, mech);
    const a = nl.dense[nl.lines[0].a];
    const g = nl.dense[nl.gnd];
    expect(idle[a] === idle[g]).toBe(false); // an idle line's A-lead is open
    expect(busy[a] === busy[g]).toBe(true); // off-hook on line 1 grounds its A-lead
  });
});
