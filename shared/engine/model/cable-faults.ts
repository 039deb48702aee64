/**
 * The conductors of one cable with its wiring faults applied: which pin at the from end meets which pin at the to
 * end. A healthy cable is pin for pin; a split or reversed pair exchanges pins at the end it was made, an open
 * conductor reaches nothing past its break.
 */
import { pairColour, pinOf, PIN_COUNT } from '../document/cable-code';
import type { Cable, CableEnd, Conductor, WiringFault } from '../document/plan.schema';

export interface CableWire {
  fromPin: number;
  toPin: number;
  /** What is wrong with this conductor, for the edge label ('' on a healthy conductor). */
  note: string;
}

const healthy: CableWire[] = Array.from({ length: PIN_COUNT }, (_, i) => ({
  fromPin: i + 1,
  toPin: i + 1,
  note: '',
}));

const other = (c: Conductor): Conductor => (c === 'tip' ? 'ring' : 'tip');
const pairWords = (pair: number) => `pair ${pair} (${pairColour(pair).name})`;

/** One sentence per fault, for labels and observations. */
export function wiringFaultWords(f: WiringFault): string {
  const at = `at the ${f.end} end`;
  if (f.kind === 'split-pair')
    return `the ${f.conductor} of ${pairWords(f.pair)} is exchanged with the ${f.conductor} of ${pairWords(f.withPair)} ${at} (split pair)`;
  if (f.kind === 'reversed-pair') return `tip and ring of ${pairWords(f.pair)} are reversed ${at}`;
  return `the ${f.conductor} of ${pairWords(f.pair)} is open ${at}`;
}

/** The cable's conductors, in pin order of the from end; a broken conductor is left out. */
export function cableWires(cable: Cable): readonly CableWire[] {
  const faults = cable.faults ?? [];
  if (!faults.length) return healthy;
  // Wire w (the conductor that is pin w at both ends of a healthy cable): where it lands at each end.
  const at: Record<CableEnd, number[]> = {
    from: Array.from({ length: PIN_COUNT + 1 }, (_, i) => i),
    to: Array.from({ length: PIN_COUNT + 1 }, (_, i) => i),
  };
  const notes: string[] = new Array(PIN_COUNT + 1).fill('');
  const broken = new Set<number>();
  const wireAt = (end: CableEnd, pin: number) => at[end].indexOf(pin);
  const swap = (end: CableEnd, p: number, q: number, note: string) => {
    const wp = wireAt(end, p);
    const wq = wireAt(end, q);
    [at[end][wp], at[end][wq]] = [at[end][wq], at[end][wp]];
    notes[wp] = notes[wq] = note;
  };
  for (const f of faults) {
    const note = `: ${wiringFaultWords(f)}`;
    if (f.kind === 'split-pair') swap(f.end, pinOf(f.pair, f.conductor), pinOf(f.withPair, f.conductor), note);
    else if (f.kind === 'reversed-pair') swap(f.end, pinOf(f.pair, 'tip'), pinOf(f.pair, 'ring'), note);
    else {
      const w = wireAt(f.end, pinOf(f.pair, f.conductor));
      broken.add(w);
      notes[w] = note;
    }
  }
  const wires: CableWire[] = [];
  for (let w = 1; w <= PIN_COUNT; w++) {
    if (!broken.has(w)) wires.push({ fromPin: at.from[w], toPin: at.to[w], note: notes[w] });
  }
  return wires.sort((a, b) => a.fromPin - b.fromPin);
}

/** The pins (at the from end) of the two pairs of each split in the cable: the circuits that hear each other. */
export function splitPins(cable: Cable): { fault: WiringFault; pins: number[] }[] {
  return (cable.faults ?? []).flatMap((f) =>
    f.kind === 'split-pair'
      ? [{ fault: f, pins: [f.pair, f.withPair].flatMap((p) => [pinOf(p, f.conductor), pinOf(p, other(f.conductor))]) }]
      : [],
  );
}
