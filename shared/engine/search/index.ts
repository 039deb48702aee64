/** Sweep and cure: the search layer over the engine core. Imported through shared/engine/index.ts only. */
export {
  sweep,
  planSweep,
  setMoves,
  sweepEvents,
  eventActions,
  stationPortOfSets,
  EXHAUSTIVE_STATE_LIMIT,
  type SweepOptions,
  type SweepResult,
  type SweptFinding,
  type SweepStrategy,
  type SetMove,
  type SweepEvent,
} from './sweep';
export {
  cure,
  applyCure,
  EXHAUSTIVE_CURE_SETS,
  type CureChange,
  type CureOptions,
  type CureResult,
} from './cure';
export { checkRequired, linesOfSet, type RequiredFailure } from './required';
export { planSoundSweep, interchangeableSets, SOUND_STATE_LIMIT } from './sound-sweep';
export { proveClean, type CleanProof } from './clean-proof';
export {
  cureOptimal,
  type OptimalCureOptions,
  type OptimalCureResult,
  type CureChoiceCost,
} from './cure-solver';
export type { SweepReduction } from './sweep';
