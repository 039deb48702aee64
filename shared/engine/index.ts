/**
 * The engine's public API (see api-contract.md). UI, server and CLI import from here only.
 * Layers: document (plan, validation), model (templates → netlist → nets), observations (evaluate), search (sweep, cure).
 */
export * from './document/plan.schema';
export { findAddOn, findLeadPart, findPart, findSet, servedName, type LeadPart } from './document/parts';
export { KSU_LEAD_NAMES, describeKsuLead, stationCode, type LineKsuLeadKind } from './document/ksu-leads';
export { listWords } from './document/words';
export { formatPath, zodIssues, type Issue } from './document/issues';
export {
  validatePlan,
  crossReferenceIssues,
  type PlanIssue,
  type ValidatePlanResult,
} from './model/validate-plan';
export { canConnect, type CanConnectResult } from './model/can-connect';
export {
  pairColour,
  pinOf,
  pinToPair,
  conductorColour,
  TIP_COLOURS,
  RING_COLOURS,
  PAIR_COUNT,
  PIN_COUNT,
  type PairColour,
} from './document/cable-code';
export { leadTable, type LeadRow } from './model/lead-table';

export {
  TEMPLATES,
  getTemplate,
  ksuPortName,
  standardLinePairs,
  tenKeyExtraPairs,
  BUZZER_PAIR,
  SPARE_PAIR,
  HANDS_FREE_PAIRS,
} from './templates/part-templates';
export type * from './templates/template.types';
export { lineOfDesignation } from './templates/designations';

export { standardCrossConnect, effectiveCrossConnect } from './model/cross-connect';
export { getNetlist, type Netlist } from './model/netlist';
export {
  applyLeadChanges,
  leadChangeWork,
  liftCost,
  partLeads,
  type ChangedLead,
  type PartLeads,
  type PlacedLead,
} from './model/lead-changes';
export { createMech, fillMech, evaluateNets, type Mech } from './model/nets';

export * from './sim/state.schema';
export {
  initialState,
  normaliseState,
  applyAction,
  applyActions,
  COMPLETE_NUMBER_LENGTH,
} from './sim/actions';
export { actionProblem, readState, type ReadStateResult, type StateIssue } from './sim/state-check';

export {
  evaluate,
  evaluateWithNets,
  evaluateFindings,
  computeNets,
  type EvaluateOptions,
  type StateNets,
} from './observe/evaluate';
export { CADENCES, TONES, strongestCadence } from './observe/signals';
export { findingKey } from './observe/finding-key';
export * from './observe/evaluation.types';

export * from './search/index';
