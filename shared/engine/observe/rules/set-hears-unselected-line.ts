/** A set's speech network on a line its keys did not select. */
import { mayHearUnselected } from '../../model/coarse-nets';
import { describeVia, hopsOf, networkTerminal, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';
import type { Finding } from '../evaluation.types';
import { bySetPosition, findingMemo, KEY_SLOTS } from '../finding-memo';

export const setHearsUnselectedLine: StateRule<'SET_HEARS_UNSELECTED_LINE'> = {
  kind: 'state',
  code: 'SET_HEARS_UNSELECTED_LINE',
  fires: { position: true, event: false },
  bySet: true,
  possibleIn: ({ coarse }) => mayHearUnselected(coarse),
  find(f, out, positions) {
    const { nl, mech, facts, finder } = f;
    const nLines = nl.lines.length;
    const memo = findingMemo(nl, 'SET_HEARS_UNSELECTED_LINE');
    for (const s of nl.sets) {
      const heard = facts.hears[s.index];
      if (!heard.length) continue;
      const selected = f.selected[s.index];
      const networkTip = finder ? networkTerminal(f, s.index) : -1;
      const pressed = mech.pressedKey[s.index];
      for (const i of heard) {
        const line = nl.lines[i].number;
        if (selected.includes(line)) continue;
        const p = networkTip >= 0 ? pathIn(finder, nl.lines[i].t, networkTip) : null;
        // what the finding says: the set, the line, the key latched (it decides the selected lines), the path
        const key = (s.index * nLines + i) * KEY_SLOTS + pressed;
        positions.push(bySetPosition(nl, s.index, i));
        const hit = memo.get(key, p);
        if (hit) {
          out.push(hit);
          continue;
        }
        const keyText = pressed > 0 ? `with line key ${selected.join(', ')} down` : 'with no line key down';
        const finding: Finding = {
          code: 'SET_HEARS_UNSELECTED_LINE',
          severity: 'fault',
          sets: [s.id],
          lines: [line],
          stations: [],
          message: `${s.name} hears line ${line} ${keyText}${p ? describeVia(f, p) : ''}.`,
          path: hopsOf(finder, p),
        };
        out.push(memo.keep(key, p, finding));
      }
    }
  },
};
