/**
 * A finding's conductor path said the way a restorer reads it: which parts' conductors meet, on which pair (its
 * 25-pair colour name), through which parts; and the path as a strip, part → pair → part. Pure, from the hops.
 */
import { conductorColour, pairColour, type Finding, type Hop } from '@shared/engine';

export interface PairStep {
  kind: 'pair';
  pair: number;
  conductor?: 'tip' | 'ring';
  /** The pair's colour name, e.g. "violet-green". */
  name: string;
  tip: string;
  ring: string;
  /** The colour of the conductor carried, when the hop names it. */
  colour?: string;
}
export interface PartStep {
  kind: 'part';
  part: string;
  name: string;
}
export type PathStep = PartStep | PairStep;

function pairStep(hop: Hop & { pair: number }): PairStep {
  const colours = pairColour(hop.pair);
  return {
    kind: 'pair',
    pair: hop.pair,
    conductor: hop.conductor,
    name: colours.name,
    tip: conductorColour(hop.pair, 'tip'),
    ring: conductorColour(hop.pair, 'ring'),
    colour: hop.conductor ? conductorColour(hop.pair, hop.conductor) : undefined,
  };
}

const hasPair = (hop: Hop): hop is Hop & { pair: number } => typeof hop.pair === 'number';

/**
 * Consecutive hops in one part are one step. Between two parts the pair the cable carries is shown when it differs
 * from the last one shown (a moved lead changes it), so a path on one pair names it once.
 */
export function pathStrip(path: Hop[]): PathStep[] {
  const steps: PathStep[] = [];
  let lastPart: string | null = null;
  let shown: PairStep | null = null;
  for (const hop of path) {
    if (lastPart === hop.part) continue;
    const carried = lastPart !== null && hasPair(hop) ? pairStep(hop) : null;
    if (carried && (shown?.pair !== carried.pair || shown.conductor !== carried.conductor)) {
      steps.push(carried);
      shown = carried;
    }
    lastPart = hop.part;
    steps.push({ kind: 'part', part: hop.part, name: hop.partName });
  }
  return steps;
}

const list = (names: string[]) =>
  names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;

function sayPair(p: PairStep): string {
  const conductor = p.conductor && p.colour ? ` ${p.conductor} (the ${p.colour} conductor)` : '';
  return `pair ${p.pair} (${p.name})${conductor}`;
}

/** One sentence: where the conductors meet. Empty when the finding has no path. */
export function pathSentence(finding: Pick<Finding, 'path'>): string {
  const { path } = finding;
  if (!path.length) return '';
  const parts = pathStrip(path).filter((s): s is PartStep => s.kind === 'part');
  const ends = [...new Set([parts[0].name, parts.at(-1)!.name])];
  const through = [...new Set(parts.slice(1, -1).map((p) => p.name))].filter((n) => !ends.includes(n));
  const pairs = [
    ...new Map(path.filter(hasPair).map((h) => [`${h.pair}|${h.conductor}`, pairStep(h)])).values(),
  ];
  const on = pairs.length ? ` on ${list(pairs.map(sayPair))}` : '';
  const via = through.length ? `, through ${list(through)}` : ', directly';
  const who = ends.length > 1 ? `The conductors of ${list(ends)} meet` : `Conductors meet in ${ends[0]}`;
  return `${who}${on}${via}.`;
}
