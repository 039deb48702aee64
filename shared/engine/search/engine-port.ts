/**
 * The core functions sweep and cure call, gathered in one place so search/ depends on the core through one file.
 * Imports point at the core's modules (not ../index) so that index.ts can re-export search/ without a cycle.
 */
export { findAddOn, findLeadPart, findSet } from '../document/parts';
export { stationCode } from '../document/ksu-leads';
export { countWords } from '../document/words';
export { getTemplate, TEMPLATES } from '../templates/part-templates';
export { lineOfDesignation } from '../templates/designations';
export { standardCrossConnect, effectiveCrossConnect } from '../model/cross-connect';
export {
  applyLeadChanges,
  liftCost,
  partLeads,
  type PartLeads,
  type PlacedLead,
} from '../model/lead-changes';
export { applyAction, applyActions, initialState } from '../sim/actions';
export {
  evaluate,
  evaluateWithNets,
  evaluateFindings,
  evaluateFindingsWithPaths,
  eventFindings,
  eventMayAddFindings,
  computeNets,
  computeNetsInto,
  createMechFor,
} from '../observe/evaluate';
export { findingKey } from '../observe/finding-key';
export { wiringFindings } from '../observe/findings';
export { lineStatesOf, observeLines, observeSets, observeStations } from '../observe/observations';
export type { Plan, LeadChange, CrossConnect, KeySet, AddOn } from '../document/plan.schema';
export type { SimState, SimAction, SetState } from '../sim/state.schema';
export type { Evaluation, Finding, FindingCode, Hop } from '../observe/evaluation.types';
export { getNetlist, type Netlist } from '../model/netlist';
export { RULES } from '../observe/rules/index';
export { FINDING_TITLES } from '../observe/evaluation.types';
export type { StateRule } from '../observe/rule.types';
export { buildCoarseNets, type CoarsePosition } from '../model/coarse-nets';
