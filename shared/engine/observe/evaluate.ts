/**
 * Observations and findings for one plan in one state: (plan, state) → nets → observations → findings.
 * Observations: ./observations.ts; findings: the rules of ./rules/ run by ./findings.ts.
 */
import type { Plan } from '../document/plan.schema';
import { getNetlist } from '../model/netlist';
import type { SimState } from '../sim/state.schema';
import type { Evaluation, Finding } from './evaluation.types';
import { allFindings, eventMayAddFindings, eventRulesFor, findingFacts, stateFindings } from './findings';
import {
  buzzersOn,
  lineFacts,
  lineStatesOf,
  observeLines,
  observeSets,
  observeStations,
} from './observations';
import { withWiringSymptoms } from './wiring-symptoms';
import { computeNetsScratch, type StateNets } from './state-nets';

export { computeNets, computeNetsInto, createMechFor, type StateNets } from './state-nets';
export { eventMayAddFindings };

export interface EvaluateOptions {
  /** Trace conductor paths and write path-based sentences (default true). Sweeps turn it off for speed. */
  paths?: boolean;
}

export function evaluate(plan: Plan, state: SimState, options: EvaluateOptions = {}): Evaluation {
  // the nets in scratch buffers: nothing of them is in the evaluation it returns
  return evaluateWithNets(plan, state, computeNetsScratch(plan, state), options);
}

/** Same as evaluate, with nets from computeNets for a state with the same set states. */
export function evaluateWithNets(
  plan: Plan,
  state: SimState,
  nets: StateNets,
  options: EvaluateOptions = {},
): Evaluation {
  const nl = getNetlist(plan);
  const paths = options.paths !== false;
  const lineStates = lineStatesOf(nl, state);
  const lines = observeLines(nl, nets.facts, lineStates);
  const { sets, buzzerOn } = observeSets(nl, state, nets.mech, nets.facts, lineStates, lines);
  const stations = observeStations(nl, state, buzzerOn);
  const facts = findingFacts(nl, state, nets, lineStates, lines, buzzerOn, paths);
  // cable wiring faults add their symptoms (hum, a polarised element that fails) to the observations
  return withWiringSymptoms(nl, nets.facts, { lines, sets, stations, findings: allFindings(facts, paths) });
}

/**
 * Findings only, without observations and (by default) without paths: the sweep's hot path. Same codes, sets, lines,
 * stations and messages (minus path-based wording) as evaluate(plan, state, { paths: false }).findings; with paths,
 * the findings of evaluate(plan, state) themselves.
 */
export function evaluateFindings(plan: Plan, state: SimState, nets: StateNets, paths = false): Finding[] {
  const nl = getNetlist(plan);
  const lineStates = lineStatesOf(nl, state);
  const lines = lineFacts(nl, nets.facts, lineStates, true);
  const buzzerOn = buzzersOn(nl, state, nets.facts);
  return allFindings(findingFacts(nl, state, nets, lineStates, lines, buzzerOn, paths), paths);
}

/**
 * The findings of evaluate(plan, state), paths and path-based wording included, without observing lines, sets or
 * stations (the sweep's last pass over the states it keeps): the same rules over the same facts, so the same
 * findings in the same order.
 */
export function evaluateFindingsWithPaths(plan: Plan, state: SimState): Finding[] {
  return evaluateFindings(plan, state, computeNetsScratch(plan, state), true);
}

/**
 * The findings a KSU event adds to those of its mechanical state, for the sweep: it evaluates each mechanical
 * state once with the KSU idle (evaluateFindings over initialState's lines) and every other event with this. The
 * keys (code, sets, lines, stations) of evaluateFindings(plan, state, nets) are exactly those of that idle
 * evaluation and of these: no event changes which leads are joined, so only the rules that say an event can fire
 * them (`fires.event`) can add one, and only where their `eventMayAdd` allows. The findings returned are the ones
 * evaluateFindings returns for them.
 */
export function eventFindings(plan: Plan, state: SimState, nets: StateNets): Finding[] {
  if (!eventMayAddFindings(state)) return [];
  const nl = getNetlist(plan);
  const rules = eventRulesFor(state, { nl, facts: nets.facts });
  if (!rules.length) return [];
  const lineStates = lineStatesOf(nl, state);
  const lines = lineFacts(nl, nets.facts, lineStates, false);
  const buzzerOn = state.intercom.calling ? buzzersOn(nl, state, nets.facts) : [];
  return stateFindings(findingFacts(nl, state, nets, lineStates, lines, buzzerOn, false, true), rules);
}
