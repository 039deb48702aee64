/**
 * The 25-pair cable colour code and the 50-pin connector pin-out.
 * Colours: ICEA S-80-576 (tip colours white, red, black, yellow, violet; ring colours blue, orange, green, brown, slate).
 * Pins: USOC RJ21X (47 CFR Part 68 Subpart F, carried into TIA-968-A / TIA-1096-A): ring of pair n on pin n, tip on pin n+25.
 */
import type { Conductor } from './plan.schema';

export const TIP_COLOURS = ['white', 'red', 'black', 'yellow', 'violet'] as const;
export const RING_COLOURS = ['blue', 'orange', 'green', 'brown', 'slate'] as const;
export type TipColour = (typeof TIP_COLOURS)[number];
export type RingColour = (typeof RING_COLOURS)[number];

export const PAIR_COUNT = 25;
export const PIN_COUNT = 50;

export interface PairColour {
  tip: TipColour;
  ring: RingColour;
  /** e.g. "violet-slate" */
  name: string;
}

function checkPair(pair: number): void {
  if (!Number.isInteger(pair) || pair < 1 || pair > PAIR_COUNT) {
    throw new RangeError(`Pair ${pair} does not exist on a 25-pair cable`);
  }
}

export function pairColour(pair: number): PairColour {
  checkPair(pair);
  const tip = TIP_COLOURS[Math.floor((pair - 1) / 5)];
  const ring = RING_COLOURS[(pair - 1) % 5];
  return { tip, ring, name: `${tip}-${ring}` };
}

export function pinOf(pair: number, conductor: Conductor): number {
  checkPair(pair);
  return conductor === 'ring' ? pair : pair + PAIR_COUNT;
}

/** The pair and conductor carried on a connector pin (inverse of pinOf). */
export function pinToPair(pin: number): { pair: number; conductor: Conductor } {
  if (!Number.isInteger(pin) || pin < 1 || pin > PIN_COUNT) throw new RangeError(`Pin ${pin} does not exist`);
  return pin > PAIR_COUNT ? { pair: pin - PAIR_COUNT, conductor: 'tip' } : { pair: pin, conductor: 'ring' };
}

/** Colour of one conductor as a restorer says it: "violet of violet-green" style, shortened to "violet-green tip". */
export function conductorColour(pair: number, conductor: Conductor): string {
  const c = pairColour(pair);
  return conductor === 'tip' ? c.tip : c.ring;
}
