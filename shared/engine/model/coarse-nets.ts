/**
 * Coarse nets: one picture of the nets that every combination of set positions refines, for proving that no state
 * of a plan shows a finding without visiting the states (search/clean-proof.ts; argument in search/README.md,
 * "Clean proof").
 *
 * A static component (dense id) that only one set's contacts touch (the set with the add-ons serving it) is that
 * set's own: in a state, only that set's position decides what it is joined to. Such a component gets one coarse
 * vertex per position of its set; every other component (the KSU's leads and ground, components two sets' contacts
 * touch, components no contact touches) is one fixed vertex. Each contact of each set joins, for every position of
 * the set that closes it, the vertices of its two ends in that position. Mapping each component of a state to its
 * vertex (its set's position in the state for a set's own component) maps every closed contact of the state onto a
 * coarse edge, so two terminals on one net of the state are on one coarse net. A spurious coarse join needs two
 * different positions of one set, or sets whose positions cannot go together in any one state.
 */
import { findRoot, type Netlist } from './netlist';
import { contactClosed, createMech, type Mech } from './nets';

/** One position of a set, as the nets read it (a key index whose key is no line key reads as none). */
export interface CoarsePosition {
  offHook: boolean;
  pressedKey: number;
  handsFreeOn: boolean;
}

export interface CoarseNets {
  nl: Netlist;
  /** Per set index: the positions the states may put it in. */
  positions: readonly (readonly CoarsePosition[])[];
  /** Per dense component: the set whose position alone decides its joins, or -1 (a fixed vertex). */
  ownerOf: Int32Array;
  /** Coarse vertex of dense component d with its owner in position p (p is not read for a fixed component). */
  vertex(d: number, p: number): number;
  /** Coarse net (root vertex) of every vertex, joined over every position of every set. */
  root: Int32Array;
  /** Coarse nets over the positions `skip` leaves in: every state that puts no set in a skipped position refines them. */
  without(skip: (set: number, position: number) => boolean): Int32Array;
}

/** The coarse nets of a netlist over the given positions of each set (indexed like netlist.sets). */
export function buildCoarseNets(nl: Netlist, positions: readonly (readonly CoarsePosition[])[]): CoarseNets {
  const m = nl.denseCount;
  const { ca, cb, cond, mech: by, key, count } = nl.hot;
  // -2: no contact touches it; s: only set s's contacts; -1: several sets' contacts or a KSU lead.
  const ownerOf = new Int32Array(m).fill(-2);
  const touch = (d: number, s: number) => {
    const o = ownerOf[d];
    ownerOf[d] = o === -2 || o === s ? s : -1;
  };
  for (let k = 0; k < count; k++) {
    touch(ca[k], by[k]);
    touch(cb[k], by[k]);
  }
  const d = nl.dense;
  const ksuTerminals = [nl.gnd, ...nl.lines.flatMap((l) => [l.t, l.r, l.a, l.l])];
  for (const st of nl.stations) ksuTerminals.push(st.t, st.r);
  for (const t of ksuTerminals) ownerOf[d[t]] = -1;
  for (let i = 0; i < m; i++) if (ownerOf[i] === -2) ownerOf[i] = -1;

  // A set's own components, numbered per set; each position of the set has a block of vertices for them.
  const nSets = nl.sets.length;
  const local = new Int32Array(m).fill(-1);
  const ownCount = new Int32Array(nSets);
  for (let i = 0; i < m; i++) if (ownerOf[i] >= 0) local[i] = ownCount[ownerOf[i]]++;
  const base = new Int32Array(nSets);
  let size = m;
  for (let s = 0; s < nSets; s++) {
    base[s] = size;
    size += ownCount[s] * (positions[s]?.length ?? 0);
  }
  const vertex = (x: number, p: number): number => {
    const o = ownerOf[x];
    return o < 0 ? x : base[o] + p * ownCount[o] + local[x];
  };

  // Per contact, the positions of its set that close it.
  const mech: Mech = createMech(nl);
  const closedIn: number[][] = new Array(count);
  for (let k = 0; k < count; k++) {
    const s = by[k];
    const list: number[] = [];
    (positions[s] ?? []).forEach((pos, p) => {
      mech.offHook[s] = pos.offHook ? 1 : 0;
      mech.pressedKey[s] = pos.pressedKey;
      mech.handsFreeOn[s] = pos.handsFreeOn ? 1 : 0;
      if (contactClosed(cond[k], s, key[k], mech)) list.push(p);
    });
    closedIn[k] = list;
  }

  const join = (skip: ((set: number, position: number) => boolean) | null): Int32Array => {
    const parent = new Int32Array(size);
    for (let i = 0; i < size; i++) parent[i] = i;
    for (let k = 0; k < count; k++) {
      const s = by[k];
      for (const p of closedIn[k]) {
        if (skip?.(s, p)) continue;
        const a = findRoot(parent, vertex(ca[k], p));
        const b = findRoot(parent, vertex(cb[k], p));
        if (a !== b) parent[a] = b;
      }
    }
    for (let i = 0; i < size; i++) parent[i] = findRoot(parent, i);
    return parent;
  };

  return { nl, positions, ownerOf, vertex, root: join(null), without: (skip) => join(skip) };
}

/** The coarse net of a terminal that is a fixed vertex (KSU leads and ground), in `root`. */
export function fixedNet(c: CoarseNets, terminal: number, root: Int32Array = c.root): number {
  return root[c.vertex(c.nl.dense[terminal], 0)];
}

/** Largest number of joint positions forEachPlacement visits; beyond it the caller must assume the worst. */
const PLACEMENT_LIMIT = 20_000;

/**
 * Visits every joint position (`at[s]` for each set s in `sets`) of the sets whose positions place these dense
 * components, together with `sets` themselves; `netOf(d)` is then the coarse net of component d. Returns 'too-many'
 * when there are too many joint positions to visit (nothing visited), else whether visit always returned true.
 */
export function forEachPlacement(
  c: CoarseNets,
  components: readonly number[],
  sets: readonly number[],
  visit: (at: Int32Array, netOf: (d: number) => number) => boolean,
): boolean | 'too-many' {
  const involved = [...new Set([...sets, ...components.map((x) => c.ownerOf[x]).filter((o) => o >= 0)])];
  let product = 1;
  for (const s of involved) product *= Math.max(c.positions[s]?.length ?? 0, 1);
  if (product > PLACEMENT_LIMIT) return 'too-many';
  const at = new Int32Array(c.nl.sets.length);
  const netOf = (x: number): number => {
    const o = c.ownerOf[x];
    return c.root[c.vertex(x, o < 0 ? 0 : at[o])];
  };
  const walk = (k: number): boolean => {
    if (k === involved.length) return visit(at, netOf);
    const s = involved[k];
    const n = Math.max(c.positions[s]?.length ?? 0, 1);
    for (let p = 0; p < n; p++) {
      at[s] = p;
      if (!walk(k + 1)) return false;
    }
    return true;
  };
  return walk(0);
}

/** Line numbers a set in a position has selected (its latched line key's line, or its fixed lines). */
export function selectedIn(c: CoarseNets, set: number, position: number): number[] {
  const s = c.nl.sets[set];
  const key = c.positions[set]?.[position]?.pressedKey ?? 0;
  if (key > 0) return s.keyLine[key] > 0 ? [s.keyLine[key]] : [];
  return s.fixedLines;
}

/**
 * Whether some joint position lets `test` pass on the lines (indices) a set's speech networks may be across: a
 * network is across line i only if its ends are on the coarse nets of line i's tip and ring. Too many joint
 * positions to visit count as passing.
 */
export function mayHear(
  c: CoarseNets,
  set: number,
  test: (heard: readonly number[], position: number) => boolean,
): boolean {
  const { nl } = c;
  const d = nl.dense;
  const networks = nl.elements.filter((e) => e.kind === 'network' && e.owner === set);
  if (!networks.length) return false;
  const ends = networks.flatMap((e) => [d[e.a], d[e.b]]);
  const rootT = nl.lines.map((l) => fixedNet(c, l.t));
  const rootR = nl.lines.map((l) => fixedNet(c, l.r));
  const heard: number[] = [];
  const outcome = forEachPlacement(c, ends, [set], (at, netOf) => {
    heard.length = 0;
    for (const e of networks) {
      const ra = netOf(d[e.a]);
      const rb = netOf(d[e.b]);
      for (let i = 0; i < rootT.length; i++) {
        if ((ra === rootT[i] && rb === rootR[i]) || (ra === rootR[i] && rb === rootT[i])) {
          if (!heard.includes(i)) heard.push(i);
        }
      }
    }
    return !(heard.length && test(heard, at[set]));
  });
  return outcome !== true;
}

/**
 * Sets whose buzzer may be across a station's buzzer output (its ends on the coarse nets of the output's two
 * sides) in some joint position; too many joint positions to visit count as may.
 */
export function mayBuzz(c: CoarseNets, station: number): number[] {
  const { nl } = c;
  const d = nl.dense;
  const st = nl.stations[station];
  const t = fixedNet(c, st.t);
  const r = fixedNet(c, st.r);
  const out = new Set<number>();
  for (const e of nl.elements) {
    if (e.kind !== 'buzzer' || e.owner < 0 || out.has(e.owner)) continue;
    const outcome = forEachPlacement(c, [d[e.a], d[e.b]], [], (_, netOf) => {
      const ra = netOf(d[e.a]);
      const rb = netOf(d[e.b]);
      return !((ra === t && rb === r) || (ra === r && rb === t));
    });
    if (outcome !== true) out.add(e.owner);
  }
  return [...out].sort((a, b) => a - b);
}

/** Whether some set may hear a line it has not selected, in one joint position (SET_HEARS_UNSELECTED_LINE, BREAK_IN). */
export function mayHearUnselected(c: CoarseNets): boolean {
  const { nl } = c;
  return nl.sets.some((s) =>
    mayHear(c, s.index, (heard, position) => {
      const selected = selectedIn(c, s.index, position);
      return heard.some((i) => !selected.includes(nl.lines[i].number));
    }),
  );
}
