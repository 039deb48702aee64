/** A set hearing a line it did not select while another set is on that line's call through its own key. */
import { mayHearUnselected } from '../../model/coarse-nets';
import type { SetInfo } from '../../model/netlist';
import type { FarPhase } from '../../sim/state.schema';
import { describeVia, hopsOf, networkTerminal, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';
import type { Finding } from '../evaluation.types';
import { bySetFinding, listId, memoFinding } from '../finding-memo';

const TALKING: ReadonlySet<FarPhase> = new Set(['talking', 'answered']);

export const breakIn: StateRule<'BREAK_IN'> = {
  kind: 'state',
  code: 'BREAK_IN',
  fires: { position: true, event: false },
  bySet: true,
  // The set breaking in hears a line it has not selected (the sets on the call select it): that is possible first.
  possibleIn: ({ coarse }) => mayHearUnselected(coarse),
  find(f, out) {
    const { nl, facts, finder, active, selected } = f;
    const nSets = nl.sets.length;
    const nLines = nl.lines.length;
    // Per line index: the sets on it through their own key, in set order (listeners other than them break in).
    const onCallByLine: (SetInfo[] | undefined)[] = new Array(nLines);
    const onCallIds: number[] = new Array(nLines);
    for (const s of nl.sets) {
      const heard = facts.hears[s.index];
      if (!heard.length) continue;
      const networkTip = finder ? networkTerminal(f, s.index) : -1;
      for (const i of heard) {
        const line = nl.lines[i].number;
        if (selected[s.index].includes(line)) continue;
        let onCall = onCallByLine[i];
        if (!onCall) {
          onCall = onCallByLine[i] = nl.sets.filter(
            (o) => active[o.index] && selected[o.index].includes(line) && facts.hears[o.index].includes(i),
          );
          onCallIds[i] = onCall.length
            ? listId(
                nl,
                onCall.map((o) => o.index),
              )
            : -1;
        }
        if (!onCall.length || (onCall.length === 1 && onCall[0] === s)) continue;
        const p = networkTip >= 0 ? pathIn(finder, nl.lines[i].t, networkTip) : null;
        const talking = TALKING.has(f.lines[i].far);
        // what the finding says: the set, the line, who is on the call, whether the far party talks, the path
        const key = ((onCallIds[i] * nSets + s.index) * nLines + i) * 2 + (talking ? 1 : 0);
        out.push(
          memoFinding(nl, 'BREAK_IN', key, p, () => {
            const others = onCall.includes(s) ? onCall.filter((o) => o !== s) : onCall;
            const parties = [...others.map((o) => o.name), ...(talking ? ['the far party'] : [])];
            const finding: Finding = {
              code: 'BREAK_IN',
              severity: 'fault',
              sets: [s.id, ...others.map((o) => o.id)],
              lines: [line],
              stations: [],
              message: `${s.name} breaks into the call on line ${line} and hears ${parties.join(' and ')}${p ? describeVia(f, p) : ''}.`,
              path: hopsOf(finder, p),
            };
            return bySetFinding(nl, finding);
          }),
        );
      }
    }
  },
};
