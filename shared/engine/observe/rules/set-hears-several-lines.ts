/** A set's speech network across more than one line at once. */
import { mayHear } from '../../model/coarse-nets';
import { listWords } from '../../document/words';
import { describeVia, hopsOf, networkTerminal, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';
import { bySetPosition, memoFinding } from '../finding-memo';

export const setHearsSeveralLines: StateRule<'SET_HEARS_SEVERAL_LINES'> = {
  kind: 'state',
  code: 'SET_HEARS_SEVERAL_LINES',
  fires: { position: true, event: false },
  bySet: true,
  // Two lines heard in a state are two lines heard in one joint position of the sets placing the networks.
  possibleIn: ({ coarse }) =>
    coarse.nl.sets.some((s) => mayHear(coarse, s.index, (heard) => heard.length > 1)),
  find(f, out, positions) {
    const { nl, facts, finder } = f;
    const nLines = nl.lines.length;
    for (const s of nl.sets) {
      const heard = facts.hears[s.index];
      if (heard.length < 2) continue;
      const networkTip = finder ? networkTerminal(f, s.index) : -1;
      const selected = f.selected[s.index];
      const stray = heard.find((i) => !selected.includes(nl.lines[i].number)) ?? heard[1];
      const p = networkTip >= 0 ? pathIn(finder, nl.lines[stray].t, networkTip) : null;
      // what the finding says: the set, the lines it hears (one bit each, up to 20 lines) and the path
      let heardBits = 0;
      for (const i of heard) heardBits |= 1 << i;
      const key = nLines <= 20 ? s.index * (1 << 20) + heardBits : -1;
      out.push(
        memoFinding(nl, 'SET_HEARS_SEVERAL_LINES', key, p, () => {
          const heardNumbers = heard.map((i) => nl.lines[i].number);
          return {
            code: 'SET_HEARS_SEVERAL_LINES',
            severity: 'fault',
            sets: [s.id],
            lines: heardNumbers,
            stations: [],
            message: `${s.name} hears lines ${listWords(heardNumbers)} at once${p ? describeVia(f, p) : ''}.`,
            path: hopsOf(finder, p),
          };
        }),
      );
      positions.push(bySetPosition(nl, s.index, heard[0]));
    }
  },
};
