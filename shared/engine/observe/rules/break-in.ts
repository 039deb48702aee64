/** A set hearing a line it did not select while another set is on that line's call through its own key. */
import { mayHearUnselected } from '../../model/coarse-nets';
import type { FarPhase } from '../../sim/state.schema';
import { describeVia, hopsOf, networkTerminal, pathIn } from '../rule-helpers';
import type { FindingFacts, StateRule } from '../rule.types';
import type { Finding } from '../evaluation.types';
import type { TerminalPath } from '../paths';
import { bySetPosition, findingMemo, listId } from '../finding-memo';

const TALKING: ReadonlySet<FarPhase> = new Set(['talking', 'answered']);

/** Per line index, kept between calls (evaluation is synchronous): the list id of the sets on its call, or -1. */
let callIds = new Int32Array(0);
/** Per line index: how many sets are on its call, and the first of them. */
let callSizes = new Int32Array(0);
let callFirst = new Int32Array(0);
const onCall: number[] = [];

/** Fills `onCall` with the sets (indices, in set order) on line i's call: active, selecting it and hearing it. */
function setsOnCall(f: FindingFacts, i: number): number[] {
  const line = f.nl.lines[i].number;
  onCall.length = 0;
  for (const o of f.facts.setsOn[i]) if (f.active[o] && f.selected[o].includes(line)) onCall.push(o);
  return onCall;
}

function breakInFinding(
  f: FindingFacts,
  si: number,
  i: number,
  talking: boolean,
  p: TerminalPath | null,
): Finding {
  const { nl } = f;
  const s = nl.sets[si];
  const line = nl.lines[i].number;
  const others = setsOnCall(f, i)
    .filter((o) => o !== si)
    .map((o) => nl.sets[o]);
  const parties = [...others.map((o) => o.name), ...(talking ? ['the far party'] : [])];
  return {
    code: 'BREAK_IN',
    severity: 'fault',
    sets: [s.id, ...others.map((o) => o.id)],
    lines: [line],
    stations: [],
    message: `${s.name} breaks into the call on line ${line} and hears ${parties.join(' and ')}${p ? describeVia(f, p) : ''}.`,
    path: hopsOf(f.finder, p),
  };
}

export const breakIn: StateRule<'BREAK_IN'> = {
  kind: 'state',
  code: 'BREAK_IN',
  fires: { position: true, event: false },
  bySet: true,
  // The set breaking in hears a line it has not selected (the sets on the call select it): that is possible first.
  possibleIn: ({ coarse }) => mayHearUnselected(coarse),
  find(f, out, positions) {
    const { nl, facts, finder, selected } = f;
    const nSets = nl.sets.length;
    const nLines = nl.lines.length;
    if (callIds.length < nLines) {
      callIds = new Int32Array(nLines);
      callSizes = new Int32Array(nLines);
      callFirst = new Int32Array(nLines);
    }
    callIds.fill(-2, 0, nLines); // -2: not yet looked at
    const memo = findingMemo(nl, 'BREAK_IN');
    for (let si = 0; si < nSets; si++) {
      const heard = facts.hears[si];
      if (!heard.length) continue;
      const networkTip = finder ? networkTerminal(f, si) : -1;
      for (const i of heard) {
        if (selected[si].includes(nl.lines[i].number)) continue;
        if (callIds[i] === -2) {
          const sets = setsOnCall(f, i);
          callSizes[i] = sets.length;
          callFirst[i] = sets.length ? sets[0] : -1;
          callIds[i] = sets.length ? listId(nl, sets) : -1;
        }
        // the sets on the call other than this one break in with it
        if (!callSizes[i] || (callSizes[i] === 1 && callFirst[i] === si)) continue;
        const p = networkTip >= 0 ? pathIn(finder, nl.lines[i].t, networkTip) : null;
        const talking = TALKING.has(f.lines[i].far);
        // what the finding says: the set, the line, who is on the call, whether the far party talks, the path
        const key = ((callIds[i] * nSets + si) * nLines + i) * 2 + (talking ? 1 : 0);
        out.push(memo.get(key, p) ?? memo.keep(key, p, breakInFinding(f, si, i, talking, p)));
        positions.push(bySetPosition(nl, si, i));
      }
    }
  },
};
