/** An intercom call to one station buzzing other sets than the ones assigned to it. */
import { mayBuzz } from '../../model/coarse-nets';
import { pairColour } from '../../document/cable-code';
import type { Netlist, SetInfo } from '../../model/netlist';
import type { TerminalPath } from '../paths';
import { hopsOf, pathIn } from '../rule-helpers';
import type { StateRule } from '../rule.types';

function stationCode(nl: Netlist, id: string): string {
  return nl.stations.find((st) => st.id === id)?.code ?? id;
}

function intercomMessage(
  nl: Netlist,
  code: string,
  sounding: SetInfo[],
  extra: SetInfo[],
  p: TerminalPath | null,
): string {
  let text = `An intercom call to station ${code} buzzes ${sounding.map((s) => s.name).join(' and ')}`;
  const elsewhere = extra.filter((s) => s.station !== undefined);
  if (elsewhere.length) {
    text += `, though ${elsewhere.map((s) => `${s.name} answers station ${stationCode(nl, s.station!)}`).join(' and ')}`;
  }
  const pin = p ? p.terms.map((t) => nl.terminals[t]).find((t) => t.pair !== undefined) : undefined;
  if (pin?.pair) {
    const where = `pair ${pin.pair} (${pairColour(pin.pair).name})`;
    text += sounding.length > 1 ? `: their buzzers share ${where}` : ` on ${where}`;
  }
  return `${text}.`;
}

export const intercomSoundsSeveral: StateRule<'INTERCOM_SOUNDS_SEVERAL'> = {
  kind: 'state',
  code: 'INTERCOM_SOUNDS_SEVERAL',
  fires: { position: false, event: true },
  eventMayAdd: (state) => !!state.intercom.calling,
  // The sets sounding in a state are among those whose buzzer may be across the called station's output.
  possibleIn({ coarse, events }) {
    const { nl } = coarse;
    return nl.stations.some((station, k) => {
      if (!events.some((e) => e.intercom.calling === station.id)) return false;
      const sounding = mayBuzz(coarse, k).map((s) => nl.sets[s]);
      const extra = sounding.filter((s) => s.station !== station.id);
      return extra.length > 0 && (sounding.length > 1 || extra.some((s) => s.station !== undefined));
    });
  },
  find(f, out) {
    const { nl, finder } = f;
    const calling = f.state.intercom.calling;
    const station = calling ? nl.stations.find((s) => s.id === calling) : undefined;
    if (!station) return;
    const sounding = nl.sets.filter((s) => f.buzzerOn[s.index]);
    const extra = sounding.filter((s) => s.station !== station.id);
    // A lone unassigned set answering the only call it can hear is not a fault.
    const misdirected =
      extra.length > 0 && (sounding.length > 1 || extra.some((s) => s.station !== undefined));
    if (!misdirected) return;
    const buzzer = nl.elements.find((e) => e.kind === 'buzzer' && e.owner === extra[0].index);
    const p = buzzer ? (pathIn(finder, station.t, buzzer.a) ?? pathIn(finder, station.t, buzzer.b)) : null;
    out.push({
      code: 'INTERCOM_SOUNDS_SEVERAL',
      severity: 'fault',
      sets: sounding.map((s) => s.id),
      lines: [],
      stations: [station.id],
      message: intercomMessage(nl, station.code, sounding, extra, p),
      path: hopsOf(finder, p),
    });
  },
};
