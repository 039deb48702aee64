/**
 * A set's private leads (its own circuits for its own add-on) paralleled with another part's leads or the KSU's
 * cross-connect: wiring that is wrong in every state, whatever the keys and hookswitches do.
 */
import { pairColour } from '../../document/cable-code';
import {
  KIND_BRIDGE,
  KIND_CABLE,
  KIND_CROSS_CONNECT,
  KIND_LEAD,
  findRoot,
  perNetlist,
  rewiringOf,
  type Netlist,
  type PartInfo,
} from '../../model/netlist';
import type { Finding } from '../evaluation.types';
import {
  crossingSentence,
  findPath,
  firstCrossing,
  pathObjects,
  runsOver,
  toHops,
  type PathObjects,
  type TerminalPath,
} from '../paths';
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
 * adapters only (never through another part's terminals), and list the part terminals wired to it. Linear in the
 * netlist (flat arrays, no per-terminal lists), apart from the pairs of parts it reports.
 */
/** Scratch for collect (evaluation is synchronous), grown to the largest netlist seen. */
let buffer = new Int32Array(0);

/**
 * Terminal → its conductor through cables and adapters only (a root terminal id). A netlist rewired from another
 * (lead changes only: model/netlist.ts rewiredFrom) has that one's cables and adapters, so their conductors.
 */
const conductors = perNetlist((nl): Int32Array => {
  const before = rewiringOf(nl)?.prev;
  if (before) return conductors(before);
  const n = nl.terminals.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const { edgeA, edgeB, edgeKind } = nl;
  for (let k = 0; k < edgeA.length; k++) {
    const kind = edgeKind[k];
    if (kind !== KIND_CABLE && kind !== KIND_BRIDGE) continue;
    const ra = findRoot(parent, edgeA[k]);
    const rb = findRoot(parent, edgeB[k]);
    if (ra !== rb) parent[ra] = rb;
  }
  for (let i = 0; i < n; i++) parent[i] = findRoot(parent, i);
  return parent;
});

function collect(nl: Netlist): Shared[] {
  const { terminals, edges, parts } = nl;
  const n = terminals.length;
  const m = nl.edgeA.length;
  if (buffer.length < 2 * n + 2 * m) buffer = new Int32Array(2 * n + 2 * m);
  const root = conductors(nl);
  const find = (x: number): number => root[x];
  const { edgeA, edgeB, edgeKind } = nl;
  // Per conductor (root): the part terminals wired to it, in edge order, as a linked list over the wired edges.
  const first = buffer.subarray(0, n).fill(-1);
  const last = buffer.subarray(n, 2 * n);
  const next = buffer.subarray(2 * n, 2 * n + m);
  const attachedTerm = buffer.subarray(2 * n + m, 2 * n + 2 * m);
  let attached = 0;
  const privateLeads: number[] = [];
  for (let k = 0; k < m; k++) {
    const kind = edgeKind[k];
    if (kind !== KIND_LEAD && kind !== KIND_CROSS_CONNECT) continue;
    if (kind === KIND_LEAD && edges[k].lead?.scope === 'private') privateLeads.push(k);
    const a = edgeA[k];
    const aIsPin = terminals[a].pin !== undefined;
    const term = aIsPin ? edgeB[k] : a;
    const r = find(aIsPin ? a : edgeB[k]);
    const at = attached++;
    attachedTerm[at] = term;
    next[at] = -1;
    if (first[r] < 0) first[r] = at;
    else next[last[r]] = at;
    last[r] = at;
  }
  const found = new Map<number, Shared>();
  for (const k of privateLeads) {
    const e = edges[k];
    const owner = parts[terminals[e.a].part];
    const pinPair = terminals[e.b].pair!;
    for (let k = first[find(e.b)]; k >= 0; k = next[k]) {
      const otherTerm = attachedTerm[k];
      const other = parts[terminals[otherTerm].part];
      if (other === owner || partners(owner, other)) continue;
      const key =
        owner.index < other.index
          ? owner.index * parts.length + other.index
          : other.index * parts.length + owner.index;
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

/** A finding with what it was read from: its path's terminals, their objects and its wires' objects. */
interface Made {
  finding: Finding;
  pairs: readonly number[];
  objects: PathObjects;
  /** The netlist it was last given for (its serial number). */
  on: number;
}

/** A number per netlist, for telling which netlist a kept finding was last given for. */
let serials = 0;
const serialOf = perNetlist(() => ++serials);

/**
 * The static nets (roots) that an edit from the netlist before rewired: a net with none of the terminals the edit
 * touched has the terminals and wires it had, so a path traced in it is the one traced before.
 */
const touchedNets = perNetlist((nl): Set<number> => {
  const touched = rewiringOf(nl)?.touched;
  const roots = new Set<number>();
  if (touched) for (let t = 0; t < touched.length; t++) if (touched[t]) roots.add(nl.staticRoot[t]);
  return roots;
});

/**
 * Findings with paths, kept across netlists by their ends and pairs. A finding says only what the path's terminal
 * and wire objects say (a terminal object is a cached part wiring's: same part, name, template and lead), so when
 * the path traced in a new netlist (after an edit) runs over the same objects at the same ids, the finding is the
 * one made before.
 */
const made = new Map<number, Made>();
const MADE_MAX = 4096;

function build(nl: Netlist, withPaths: boolean): Finding[] {
  const before = withPaths ? rewiringOf(nl)?.prev : undefined;
  const serial = serialOf(nl);
  return collect(nl).map((s) => {
    const pairs = s.pairs.sort((a, b) => a - b);
    if (!withPaths) return finding(nl, s, pairs, null);
    const key = s.from * nl.terminals.length + s.to;
    const known = made.get(key);
    const again = () => {
      made.delete(key);
      made.set(key, known!);
      known!.on = serial;
      return known!.finding;
    };
    // given for the netlist this one was rewired from, on a net the edit left alone: the same path, not traced
    if (known && before && known.on === serialOf(before) && !touchedNets(nl).has(nl.staticRoot[s.from]))
      if (sameList(known.pairs, pairs)) return again();
    const p = findPath(nl, s.from, s.to, null);
    if (!p) return finding(nl, s, pairs, null);
    if (known && sameList(known.pairs, pairs) && runsOver(nl, p, known.objects)) return again();
    const f = finding(nl, s, pairs, p);
    if (made.size >= MADE_MAX) made.delete(made.keys().next().value!);
    made.set(key, {
      finding: f,
      pairs,
      objects: pathObjects(nl, p),
      on: serial,
    });
    return f;
  });
}

function sameList(a: readonly number[], b: readonly number[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

function finding(nl: Netlist, s: Shared, pairs: number[], p: TerminalPath | null): Finding {
  const pairText = pairs.map((p) => `${p} (${pairColour(p).name})`).join(', ');
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
}

export const privateLeadShared: WiringRule<'PRIVATE_LEAD_SHARED'> = {
  kind: 'wiring',
  code: 'PRIVATE_LEAD_SHARED',
  find: build,
};
