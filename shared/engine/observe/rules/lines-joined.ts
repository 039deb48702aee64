/** Two lines on one tip or ring net: one finding per group of joined lines, with the path between their tips. */
import { fixedNet } from '../../model/coarse-nets';
import { listWords } from '../../document/words';
import { hopsOf, joinSentence, latchedOn, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';
import { listId, memoFinding } from '../finding-memo';

export const linesJoined: StateRule<'LINES_JOINED'> = {
  kind: 'state',
  code: 'LINES_JOINED',
  fires: { position: true, event: false },
  // Lines joined in a state are on one coarse tip or ring net.
  possibleIn({ coarse }) {
    const t = coarse.nl.lines.map((l) => fixedNet(coarse, l.t));
    const r = coarse.nl.lines.map((l) => fixedNet(coarse, l.r));
    return t.some((x, i) => t.some((y, j) => j !== i && (x === y || r[i] === r[j])));
  },
  find(f, out) {
    const { nl, facts, finder } = f;
    let seen: number[] | null = null;
    for (let i = 0; i < f.lines.length; i++) {
      const obs = f.lines[i];
      if (!obs.joinedWith.length || seen?.includes(obs.line)) continue;
      const group = [obs.line, ...obs.joinedWith].sort((a, b) => a - b);
      (seen ??= []).push(...group);
      const involved = latchedOn(f, group);
      const other = group[0] === obs.line ? group[1] : group[0];
      const j = nl.lines.findIndex((l) => l.number === other);
      const sameTip = facts.rootT[i] === facts.rootT[j];
      const p = pathIn(
        finder,
        sameTip ? nl.lines[i].t : nl.lines[i].r,
        sameTip ? nl.lines[j].t : nl.lines[j].r,
      );
      // what the finding says: the lines, the sets latched on them, the path
      const key = listId(nl, [...group, -1, ...involved.map((s) => s.index)]);
      out.push(
        memoFinding(nl, 'LINES_JOINED', key, p, () => {
          const how =
            joinSentence(nl, p) ??
            (involved.length ? ` through ${involved.map((s) => s.name).join(' and ')}` : '');
          return {
            code: 'LINES_JOINED',
            severity: 'fault',
            sets: involved.map((s) => s.id),
            lines: group,
            stations: [],
            message: `Lines ${listWords(group)} are joined${how}.`,
            path: hopsOf(finder, p),
          };
        }),
      );
    }
  },
};
