/**
 * What a set's handset and keys do, as simulation actions, wherever the set is drawn: the operating panel, the
 * Handset panel and the fault hunt's stations.
 */
import type { SimAction } from '@shared/engine';

/** The handset toggles: on hook it is lifted, off hook it is hung up. */
export function handsetAction(set: string, offHook: boolean): SimAction {
  return offHook ? { kind: 'hang-up', set } : { kind: 'lift-handset', set };
}

/** A line key latches its line; the hold key puts the line in use on hold. */
export function keyAction(set: string, key: { index: number; kind: 'line' | 'hold' }): SimAction {
  return key.kind === 'hold' ? { kind: 'press-hold', set } : { kind: 'press-key', set, key: key.index };
}
