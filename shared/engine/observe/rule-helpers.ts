/** Small pieces the finding rules share: paths, their hops and the sentence that says where a path crosses. */
import type { Netlist, SetInfo } from '../model/netlist';
import type { Hop } from './evaluation.types';
import { layoutOf } from './observations';
import {
  crossingSentence,
  firstCrossing,
  firstUnitLeadSentence,
  unitsAlong,
  type PathFinder,
  type TerminalPath,
} from './paths';
import type { FindingFacts } from './rule.types';

/** The conductor path between two terminals in this state, when paths are traced. */
export function pathIn(finder: PathFinder | null, from: number, to: number): TerminalPath | null {
  return finder ? finder.path(from, to) : null;
}

/** The hops of a path (shared between findings on one path), or none without one. */
export function hopsOf(finder: PathFinder | null, p: TerminalPath | null): Hop[] {
  return p && finder ? finder.hopsOf(p) : [];
}

/** A terminal of the set's (or its add-on's) speech network that is on a line, for path tracing. */
export function networkTerminal(f: FindingFacts, setIndex: number): number {
  const { elements, dense } = f.nl;
  const { roots, rootT } = f.facts;
  for (const k of layoutOf(f.nl).networksOf[setIndex]) {
    const e = elements[k];
    const ra = roots[dense[e.a]];
    if (rootT.includes(ra)) return e.a;
    const rb = roots[dense[e.b]];
    if (rootT.includes(rb)) return e.b;
  }
  return -1;
}

/** describeVia's sentences by path: a path belongs to one netlist, and findings (and evaluations) share paths. */
const viaByPath = new WeakMap<TerminalPath, string>();

/** ", because Front's talk pair (CT) on pair 23 … is bridged to …": once per path (findings share paths). */
export function describeVia(f: FindingFacts, p: TerminalPath): string {
  let text = viaByPath.get(p);
  if (text === undefined) {
    const crossing = firstCrossing(f.nl, p);
    const lead = crossing ? null : firstUnitLeadSentence(f.nl, p);
    text = crossing ? `, because ${crossingSentence(crossing)}` : lead ? `, through ${lead}` : '';
    viaByPath.set(p, text);
  }
  return text;
}

/** ": Front's talk pair … is bridged to Back's", or " along Front, Back", or "" without a path. */
export function joinSentence(nl: Netlist, p: TerminalPath | null): string | null {
  if (!p) return null;
  let text = joinByPath.get(p);
  if (text === undefined) {
    const crossing = firstCrossing(nl, p);
    text = crossing ? `: ${crossingSentence(crossing)}` : ` along ${unitsAlong(nl, p).join(', ')}`;
    joinByPath.set(p, text);
  }
  return text;
}

const joinByPath = new WeakMap<TerminalPath, string>();

/** Sets with a line key down on one of these lines: the sets whose keys do the joining. */
export function latchedOn(f: FindingFacts, lines: readonly number[]): SetInfo[] {
  const { sets } = f.nl;
  const { pressedKey } = f.mech;
  const out: SetInfo[] = [];
  for (let s = 0; s < sets.length; s++) {
    if (!(pressedKey[s] > 0)) continue;
    const selected = f.selected[s];
    for (let k = 0; k < selected.length; k++) {
      if (!lines.includes(selected[k])) continue;
      out.push(sets[s]);
      break;
    }
  }
  return out;
}
