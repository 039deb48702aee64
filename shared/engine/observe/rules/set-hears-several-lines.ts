/** A set's speech network across more than one line at once. */
import { listWords } from '../../document/words';
import { describeVia, hopsOf, networkTerminal, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';

export const setHearsSeveralLines: StateRule<'SET_HEARS_SEVERAL_LINES'> = {
  kind: 'state',
  code: 'SET_HEARS_SEVERAL_LINES',
  fires: { position: true, event: false },
  bySet: true,
  find(f, out) {
    const { nl, facts, finder } = f;
    for (const s of nl.sets) {
      const heard = facts.hears[s.index];
      if (heard.length < 2) continue;
      const heardNumbers = heard.map((i) => nl.lines[i].number);
      const networkTip = finder ? networkTerminal(f, s.index) : -1;
      const stray = heard.find((i) => !f.selected[s.index].includes(nl.lines[i].number)) ?? heard[1];
      const p = networkTip >= 0 ? pathIn(finder, nl.lines[stray].t, networkTip) : null;
      out.push({
        code: 'SET_HEARS_SEVERAL_LINES',
        severity: 'fault',
        sets: [s.id],
        lines: heardNumbers,
        stations: [],
        message: `${s.name} hears lines ${listWords(heardNumbers)} at once${p ? describeVia(f, p) : ''}.`,
        path: hopsOf(finder, p),
      });
    }
  },
};
