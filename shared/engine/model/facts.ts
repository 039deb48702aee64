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

const ascending = (a: number, b: number) => a - b;

/** The speech networks among the netlist's elements, in element order: dense ids of their ends and their owner. */
interface Networks {
  a: Int32Array;
  b: Int32Array;
  owner: Int32Array;
}

const networksOf = perNetlist((nl): Networks => {
  const list: ElementInfo[] = nl.elements.filter((e) => e.kind === 'network');
  return {
    a: Int32Array.from(list, (e) => nl.dense[e.a]),
    b: Int32Array.from(list, (e) => nl.dense[e.b]),
    owner: Int32Array.from(list, (e) => e.owner),
  };
});

export function computeFacts(nl: Netlist, mech: Mech): NetFacts {
  const roots = evaluateNets(nl, mech);
  const d = nl.dense;
  const gnd = roots[d[nl.gnd]];
  const nLines = nl.lines.length;
  const rootT: number[] = new Array(nLines);
  const rootR: number[] = new Array(nLines);
  const rootL: number[] = new Array(nLines);
  const aClosed: boolean[] = new Array(nLines);
  const networkLoop: boolean[] = new Array(nLines).fill(false);
  const setsOn: number[][] = [];
  for (let i = 0; i < nLines; i++) {
    const l = nl.lines[i];
    rootT[i] = roots[d[l.t]];
    rootR[i] = roots[d[l.r]];
    rootL[i] = roots[d[l.l]];
    aClosed[i] = roots[d[l.a]] === gnd;
    setsOn.push([]);
  }
  const hears: number[][] = new Array(nl.sets.length);
  for (let s = 0; s < hears.length; s++) hears[s] = [];
  const networks = networksOf(nl);
  for (let k = 0; k < networks.a.length; k++) {
    const ra = roots[networks.a[k]];
    const rb = roots[networks.b[k]];
    if (ra === rb) continue;
    const owner = networks.owner[k];
    for (let i = 0; i < nLines; i++) {
      if ((ra === rootT[i] && rb === rootR[i]) || (ra === rootR[i] && rb === rootT[i])) {
        networkLoop[i] = true;
        if (owner >= 0 && !hears[owner].includes(i)) {
          hears[owner].push(i);
          setsOn[i].push(owner);
        }
      }
    }
  }
  for (const h of hears) if (h.length > 1) h.sort(ascending);
  for (const s of setsOn) if (s.length > 1) s.sort(ascending);
  return { aClosed, networkLoop, hears, setsOn, rootT, rootR, rootL, gnd, roots };
}

/** Line numbers a set has selected: its latched line key's line, or the lines a keyless set is always on. */
export function selectedLines(nl: Netlist, setIndex: number, mech: Mech): number[] {
  const s = nl.sets[setIndex];
  const key = mech.pressedKey[setIndex];
  if (key > 0) return s.keyLine[key] > 0 ? [s.keyLine[key]] : [];
  return s.fixedLines;
}

export function isActive(mech: Mech, setIndex: number): boolean {
  return mech.offHook[setIndex] === 1 || mech.handsFreeOn[setIndex] === 1;
}
