/**
 * A ringing line whose talk pair is joined to another line's: the ringing current rings that line's ringers and its
 * line circuit sees ringing, so its lamps flash though nobody calls it (common practice, no published source).
 */
import { fixedNet } from '../../model/coarse-nets';
import { listWords } from '../../document/words';
import { describeVia, hopsOf, latchedOn, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';

export const ringingOverJoinedLines: StateRule<'RINGING_OVER_JOINED_LINES'> = {
  kind: 'state',
  code: 'RINGING_OVER_JOINED_LINES',
  fires: { position: false, event: true },
  eventMayAdd(state, on) {
    const ringing = state.lines.filter((ls) => ls.ringing);
    if (!ringing.length || !on) return ringing.length > 0;
    const { nl, facts } = on;
    // Cheap test on the nets: some ringing line's tip net is another line's tip or ring net.
    for (let j = 0; j < nl.lines.length; j++) {
      if (!ringing.some((ls) => ls.line === nl.lines[j].number)) continue;
      for (let i = 0; i < nl.lines.length; i++)
        if (i !== j && (facts.rootT[i] === facts.rootT[j] || facts.rootR[i] === facts.rootT[j])) return true;
    }
    return false;
  },
  // Both talk conductors of the ringing line on another line's, straight or crossed, on the coarse nets.
  possibleIn({ coarse, events }) {
    const { nl } = coarse;
    const t = nl.lines.map((l) => fixedNet(coarse, l.t));
    const r = nl.lines.map((l) => fixedNet(coarse, l.r));
    return events.some((e) =>
      nl.lines.some(
        (lj, j) =>
          e.lines.some((ls) => ls.ringing && ls.line === lj.number) &&
          nl.lines.some(
            (_, i) => i !== j && ((t[i] === t[j] && r[i] === r[j]) || (t[i] === r[j] && r[i] === t[j])),
          ),
      ),
    );
  },
  find(f, out) {
    const { nl, facts, finder, lineStates } = f;
    const { rootT, rootR, roots } = facts;
    for (let j = 0; j < nl.lines.length; j++) {
      if (!lineStates[j]?.ringing || rootT[j] === rootR[j]) continue;
      for (let i = 0; i < nl.lines.length; i++) {
        if (i === j || lineStates[i]?.ringing) continue;
        const straight = rootT[i] === rootT[j] && rootR[i] === rootR[j];
        const crossed = rootT[i] === rootR[j] && rootR[i] === rootT[j];
        if (!straight && !crossed) continue;
        const ringing = nl.lines[j].number;
        const reached = nl.lines[i].number;
        // Ringers strapped to the reached line that the ringing current now crosses.
        const ringers = nl.sets.filter((s) =>
          nl.elements.some((e) => {
            if (e.kind !== 'ringer' || e.owner !== s.index || e.line !== reached) return false;
            const ra = roots[nl.dense[e.a]];
            const rb = roots[nl.dense[e.b]];
            return ra !== rb && (ra === rootT[j] || ra === rootR[j]) && (rb === rootT[j] || rb === rootR[j]);
          }),
        );
        const p = pathIn(finder, nl.lines[j].t, straight ? nl.lines[i].t : nl.lines[i].r);
        const rung = ringers.length
          ? ` and the ringer${ringers.length > 1 ? 's' : ''} of ${listWords(ringers.map((s) => s.name))} ring${ringers.length > 1 ? '' : 's'}`
          : '';
        out.push({
          code: 'RINGING_OVER_JOINED_LINES',
          severity: 'fault',
          sets: latchedOn(f, [ringing, reached]).map((s) => s.id),
          lines: [ringing, reached],
          stations: [],
          message:
            `Ringing on line ${ringing} also reaches line ${reached}, whose talk pair is joined to it` +
            `${p ? describeVia(f, p) : ''}: line ${reached}'s lamps flash${rung} though nobody calls it.`,
          path: hopsOf(finder, p),
        });
      }
    }
  },
};
