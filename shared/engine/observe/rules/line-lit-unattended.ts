/**
 * A line lit with nobody on it: its A-lead grounded though no set in use selected it (the sets' positions decide),
 * or put on hold by a set that had not selected it (a KSU event: the hold bridge lights it).
 */
import { fixedNet, selectedIn } from '../../model/coarse-nets';
import { describeVia, hopsOf, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';

export const lineLitUnattended: StateRule<'LINE_LIT_UNATTENDED'> = {
  kind: 'state',
  code: 'LINE_LIT_UNATTENDED',
  fires: { position: true, event: true },
  eventMayAdd: (state) => state.lines.some((ls) => ls.circuit === 'held' && !!ls.heldWithoutSelection),
  possibleIn({ coarse, events }) {
    // Held aside: the events' line states are the same whatever the sets do.
    if (events.some((e) => e.lines.some((ls) => ls.circuit === 'held' && !!ls.heldWithoutSelection)))
      return true;
    // Lit by its A-lead with nobody on the line: every set is in a position that does not attend the line, so the
    // state refines the coarse nets without the attending positions. Not absence of a join, but its presence there.
    const { nl } = coarse;
    return nl.lines.some((line) => {
      const root = coarse.without((s, p) => {
        const pos = coarse.positions[s][p];
        return (pos.offHook || pos.handsFreeOn) && selectedIn(coarse, s, p).includes(line.number);
      });
      return fixedNet(coarse, line.a, root) === fixedNet(coarse, nl.gnd, root);
    });
  },
  find(f, out) {
    const { nl, mech, finder, active, selected } = f;
    const nSets = nl.sets.length;
    for (let i = 0; i < f.lines.length; i++) {
      const obs = f.lines[i];
      const ls = f.lineStates[i];
      const heldAside = obs.status === 'held' && !!ls?.heldWithoutSelection;
      if (!obs.aClosed && !heldAside) continue;
      let attended = false;
      for (let si = 0; si < nSets && !attended; si++)
        attended = active[si] && selected[si].includes(obs.line);
      const litByA = obs.aClosed && !attended;
      if (!litByA && !heldAside) continue;
      if (f.eventsOnly && litByA) continue;
      const latched = nl.sets.filter(
        (s) => mech.pressedKey[s.index] > 0 && selected[s.index].includes(obs.line),
      );
      const p = litByA ? pathIn(finder, nl.lines[i].a, nl.gnd) : null;
      const why = litByA
        ? `its A-lead is grounded though no set in use has selected it${p ? describeVia(f, p) : ''}`
        : 'it went on hold though the set that pressed hold had not selected it';
      out.push({
        code: 'LINE_LIT_UNATTENDED',
        severity: 'fault',
        sets: latched.map((s) => s.id),
        lines: [obs.line],
        stations: [],
        message: `Line ${obs.line} is lit with nobody on it: ${why}.`,
        path: hopsOf(finder, p),
      });
    }
  },
};
