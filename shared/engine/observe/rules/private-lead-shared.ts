/**
 * A set's private leads (its own circuits for its own add-on) paralleled with another part's leads or the KSU's
 * cross-connect: wiring that is wrong in every state, whatever the keys and hookswitches do.
 */
import { pairColour } from '../../document/cable-code';
import type { Netlist, PartInfo } from '../../model/netlist';
import type { Finding } from '../evaluation.types';
import { findPath, firstCrossing, crossingSentence, toHops } from '../paths';
import type { WiringRule } from '../rule.types';

interface Shared {
  owner: PartInfo;
  other: PartInfo;
  pairs: number[];
  from: number;
  to: number;
}

/** May `a`'s private leads meet `b`? Only a set and the add-ons serving it (and add-ons of one set) may. */
function partners(a: PartInfo, b: PartInfo): boolean {
  if (a.kind === 'set' && b.kind === 'add-on') return b.servesSet === a.setIndex;
  if (a.kind === 'add-on' && b.kind === 'set') return a.servesSet === b.setIndex;
  if (a.kind === 'add-on' && b.kind === 'add-on') return a.servesSet >= 0 && a.servesSet === b.servesSet;
  return false;
}

/**
 * What meets each private lead in the cabling: follow the conductor from the lead's pin through cables and
 * adapters only (never through another part's terminals), and list the part terminals wired to it.
 */
function collect(nl: Netlist): Shared[] {
  const n = nl.terminals.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const find = (x: number): number => {
    while (parent[x] !== x) x = parent[x] = parent[parent[x]];
    return x;
  };
  for (const e of nl.edges) {
    if (e.kind === 'cable' || e.kind === 'bridge') parent[find(e.a)] = find(e.b);
  }
  const attached = new Map<number, number[]>();
  const wired = nl.edges.filter((e) => e.kind === 'lead' || e.kind === 'cross-connect');
  for (const e of wired) {
    const [term, pin] = nl.terminals[e.a].pin === undefined ? [e.a, e.b] : [e.b, e.a];
    const r = find(pin);
    const list = attached.get(r);
    if (list) list.push(term);
    else attached.set(r, [term]);
  }
  const found = new Map<string, Shared>();
  for (const e of nl.edges) {
    if (e.kind !== 'lead' || e.lead?.scope !== 'private') continue;
    const owner = nl.parts[nl.terminals[e.a].part];
    const pinPair = nl.terminals[e.b].pair!;
    for (const otherTerm of attached.get(find(e.b)) ?? []) {
      const other = nl.parts[nl.terminals[otherTerm].part];
      if (other === owner || partners(owner, other)) continue;
      const key =
        owner.index < other.index ? `${owner.index}|${other.index}` : `${other.index}|${owner.index}`;
      let s = found.get(key);
      if (!s) {
        s = { owner, other, pairs: [], from: e.a, to: otherTerm };
        found.set(key, s);
      }
      if (!s.pairs.includes(pinPair)) s.pairs.push(pinPair);
    }
  }
  return [...found.values()];
}

function build(nl: Netlist, withPaths: boolean): Finding[] {
  return collect(nl).map((s) => {
    const pairs = s.pairs.sort((a, b) => a - b);
    const pairText = pairs.map((p) => `${p} (${pairColour(p).name})`).join(', ');
    const p = withPaths ? findPath(nl, s.from, s.to, null) : null;
    const crossing = p ? firstCrossing(nl, p) : null;
    const otherText =
      s.other.kind === 'ksu' ? `the ${s.other.name}'s cross-connect` : `${s.other.name}'s leads`;
    const ids = [s.owner, s.other].filter((x) => x.kind !== 'ksu').map((x) => x.id);
    return {
      code: 'PRIVATE_LEAD_SHARED' as const,
      severity: 'warning' as const,
      sets: ids,
      lines: [],
      stations: [],
      message:
        `${s.owner.name}'s own leads on pair${pairs.length > 1 ? 's' : ''} ${pairText} are paralleled with ${otherText}` +
        (crossing ? ` (${crossingSentence(crossing)})` : '') +
        '.',
      path: p ? toHops(nl, p) : [],
    } satisfies Finding;
  });
}

export const privateLeadShared: WiringRule<'PRIVATE_LEAD_SHARED'> = {
  kind: 'wiring',
  code: 'PRIVATE_LEAD_SHARED',
  find: build,
};
