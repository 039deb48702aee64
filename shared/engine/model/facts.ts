/**
 * Electrical facts of one state, read off the nets: which A-leads are grounded, which lines have a loop,
 * which set hears which line. Shared by the state machine (applyAction) and the observations (evaluate).
 */
import { perNetlist, type ElementInfo, type Netlist } from './netlist';
import { evaluateNets, type Mech } from './nets';

export interface NetFacts {
  /** Per line index (netlist.lines order). */
  aClosed: boolean[];
  /** A speech network is across the line's tip and ring (the hold bridge not counted). */
  networkLoop: boolean[];
  /** Per set index: line indices its handset or hands-free network is bridged across. */
  hears: number[][];
  /** Per line index: set indices hearing it. */
  setsOn: number[][];
  /** Root of each line's T, R, L net, and of ground. */
  rootT: number[];
  rootR: number[];
  rootL: number[];
  gnd: number;
  roots: Int32Array;
}

/**
 * Once per netlist: the speech networks among its elements (in element order: dense ids of their ends and their
 * owner), the dense ids of each line's leads, and scratch tables (cleared again by each call): from a net's root
 * to the lines whose tip is on it, so that matching networks to lines costs one look-up per network end, and of
 * which set hears which line, read out in ascending order (no sorting).
 */
interface FactsLayout {
  a: Int32Array;
  b: Int32Array;
  owner: Int32Array;
  lineT: Int32Array;
  lineR: Int32Array;
  lineL: Int32Array;
  lineA: Int32Array;
  /** Per dense root: the first line (index) whose tip net it is, or -1; nextTip chains the others. */
  firstTip: Int32Array;
  nextTip: Int32Array;
  /** heard[set × lines + line]: the set's network is across the line; heardAny[set]: across some line. */
  heard: Uint8Array;
  heardAny: Uint8Array;
}

const layoutOf = perNetlist((nl): FactsLayout => {
  const list: ElementInfo[] = nl.elements.filter((e) => e.kind === 'network');
  const lead = (pick: (l: Netlist['lines'][number]) => number) =>
    Int32Array.from(nl.lines, (l) => nl.dense[pick(l)]);
  return {
    a: Int32Array.from(list, (e) => nl.dense[e.a]),
    b: Int32Array.from(list, (e) => nl.dense[e.b]),
    owner: Int32Array.from(list, (e) => e.owner),
    lineT: lead((l) => l.t),
    lineR: lead((l) => l.r),
    lineL: lead((l) => l.l),
    lineA: lead((l) => l.a),
    firstTip: new Int32Array(nl.denseCount).fill(-1),
    nextTip: new Int32Array(nl.lines.length),
    heard: new Uint8Array(nl.sets.length * nl.lines.length),
    heardAny: new Uint8Array(nl.sets.length),
  };
});

/** hears of a set that hears no line (most sets in most states): one array, never changed. */
const HEARS_NONE: number[] = Object.freeze([]) as unknown as number[];

export function computeFacts(nl: Netlist, mech: Mech): NetFacts {
  const roots = evaluateNets(nl, mech);
  const gnd = roots[nl.dense[nl.gnd]];
  const nLines = nl.lines.length;
  const {
    a,
    b,
    owner: owners,
    lineT,
    lineR,
    lineL,
    lineA,
    firstTip,
    nextTip,
    heard,
    heardAny,
  } = layoutOf(nl);
  const rootT: number[] = new Array(nLines);
  const rootR: number[] = new Array(nLines);
  const rootL: number[] = new Array(nLines);
  const aClosed: boolean[] = new Array(nLines);
  const networkLoop: boolean[] = new Array(nLines);
  const setsOn: number[][] = new Array(nLines);
  for (let i = 0; i < nLines; i++) {
    const t = roots[lineT[i]];
    rootT[i] = t;
    rootR[i] = roots[lineR[i]];
    rootL[i] = roots[lineL[i]];
    aClosed[i] = roots[lineA[i]] === gnd;
    networkLoop[i] = false;
    setsOn[i] = [];
    if (t >= 0) {
      nextTip[i] = firstTip[t];
      firstTip[t] = i;
    }
  }
  let anyHeard = false;
  for (let k = 0; k < a.length; k++) {
    const ra = roots[a[k]];
    const rb = roots[b[k]];
    if (ra === rb) continue;
    const owner = owners[k];
    // a network is across line i when one end is on its tip net and the other on its ring net
    for (let end = 0; end < 2; end++) {
      const tip = end === 0 ? ra : rb;
      const ring = end === 0 ? rb : ra;
      if (!(tip >= 0)) continue;
      for (let i = firstTip[tip]; i >= 0; i = nextTip[i]) {
        if (rootR[i] !== ring) continue;
        networkLoop[i] = true;
        if (owner < 0) continue;
        heard[owner * nLines + i] = 1;
        heardAny[owner] = 1;
        anyHeard = true;
      }
    }
  }
  for (let i = 0; i < nLines; i++) if (rootT[i] >= 0) firstTip[rootT[i]] = -1;
  const nSets = nl.sets.length;
  const hears: number[][] = new Array(nSets);
  for (let s = 0; s < nSets; s++) {
    if (!anyHeard || heardAny[s] === 0) {
      hears[s] = HEARS_NONE;
      continue;
    }
    heardAny[s] = 0;
    const list: number[] = [];
    for (let i = 0, at = s * nLines; i < nLines; i++, at++) {
      if (heard[at] === 0) continue;
      heard[at] = 0;
      list.push(i);
      setsOn[i].push(s);
    }
    hears[s] = list;
  }
  return { aClosed, networkLoop, hears, setsOn, rootT, rootR, rootL, gnd, roots };
}

/** Per set and key index: the one-line list a latched line key selects (shared: callers only read it). */
export const keySelections = perNetlist((nl) =>
  nl.sets.map((s) => s.keyLine.map((line) => (line > 0 ? [line] : []))),
);

/** Line numbers a set has selected: its latched line key's line, or the lines a keyless set is always on. */
export function selectedLines(
  nl: Netlist,
  setIndex: number,
  mech: Mech,
  selections: readonly (readonly number[][])[] = keySelections(nl),
): number[] {
  const key = mech.pressedKey[setIndex];
  if (key > 0) return selections[setIndex][key] ?? [];
  return nl.sets[setIndex].fixedLines;
}

export function isActive(mech: Mech, setIndex: number): boolean {
  return mech.offHook[setIndex] === 1 || mech.handsFreeOn[setIndex] === 1;
}
