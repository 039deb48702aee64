/** A set hearing a line it did not select while another set is on that line's call through its own key. */
import type { SetInfo } from '../../model/netlist';
import type { FarPhase } from '../../sim/state.schema';
import { describeVia, hopsOf, networkTerminal, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';

const TALKING: ReadonlySet<FarPhase> = new Set(['talking', 'answered']);

export const breakIn: StateRule<'BREAK_IN'> = {
  kind: 'state',
  code: 'BREAK_IN',
  fires: { position: true, event: false },
  bySet: true,
  find(f, out) {
    const { nl, facts, finder, active, selected } = f;
    // Per line index: the sets on it through their own key, in set order (listeners other than them break in).
    const onCallByLine: (SetInfo[] | undefined)[] = new Array(nl.lines.length);
    for (const s of nl.sets) {
      const heard = facts.hears[s.index];
      if (!heard.length) continue;
      const networkTip = finder ? networkTerminal(f, s.index) : -1;
      for (const i of heard) {
        const line = nl.lines[i].number;
        if (selected[s.index].includes(line)) continue;
        const onCall = (onCallByLine[i] ??= nl.sets.filter(
          (o) => active[o.index] && selected[o.index].includes(line) && facts.hears[o.index].includes(i),
        ));
        const others = onCall.includes(s) ? onCall.filter((o) => o !== s) : onCall;
        if (!others.length) continue;
        const p = networkTip >= 0 ? pathIn(finder, nl.lines[i].t, networkTip) : null;
        const parties = [
          ...others.map((o) => o.name),
          ...(TALKING.has(f.lines[i].far) ? ['the far party'] : []),
        ];
        out.push({
          code: 'BREAK_IN',
          severity: 'fault',
          sets: [s.id, ...others.map((o) => o.id)],
          lines: [line],
          stations: [],
          message: `${s.name} breaks into the call on line ${line} and hears ${parties.join(' and ')}${p ? describeVia(f, p) : ''}.`,
          path: hopsOf(finder, p),
        });
      }
    }
  },
};
