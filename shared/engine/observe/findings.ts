/** Finding evaluation: the registry's state rules over one state's facts, then the wiring rules (once per netlist). */
import { isActive, keySelections, selectedLines, type NetFacts } from '../model/facts';
import type { Netlist } from '../model/netlist';
import type { Finding } from './evaluation.types';
import { PathFinder } from './paths';
import type { FindingFacts, LineFacts, StateRule, WiringRule } from './rule.types';
import { RULES } from './rules/index';
import type { StateNets } from './state-nets';
import type { LineState, SimState } from '../sim/state.schema';

const ALL = Object.values(RULES);
const STATE_RULES = ALL.filter((r): r is StateRule => r.kind === 'state');
const WIRING_RULES = ALL.filter((r): r is WiringRule => r.kind === 'wiring');
const EVENT_RULES = STATE_RULES.filter((r) => r.fires.event);

/** The facts every state rule reads, from the state's nets and its per-line facts. */
export function findingFacts(
  nl: Netlist,
  state: SimState,
  nets: StateNets,
  lineStates: (LineState | undefined)[],
  lines: LineFacts[],
  buzzerOn: boolean[],
  paths: boolean,
  eventsOnly = false,
): FindingFacts {
  const { mech, facts } = nets;
  const nSets = nl.sets.length;
  const selected: number[][] = new Array(nSets);
  const active: boolean[] = new Array(nSets);
  const selections = keySelections(nl);
  for (let si = 0; si < nSets; si++) {
    selected[si] = selectedLines(nl, si, mech, selections);
    active[si] = isActive(mech, si);
  }
  return {
    nl,
    state,
    mech,
    facts,
    lineStates,
    lines,
    selected,
    active,
    buzzerOn,
    finder: paths ? new PathFinder(nl, mech, facts.roots) : null,
    eventsOnly,
  };
}

/** The positions argument of a rule not listed by set (it appends none). */
const NO_POSITIONS: number[] = [];

let startBuffer = new Int32Array(0);
let keyBuffer = new Int32Array(0);

/**
 * Findings about sets, from consecutive bySet rules: by set, then line, then rule, on the positions the rules gave
 * beside them. A counting sort (stable, no comparisons): a state of a large plan has hundreds of these.
 */
function mergeBySet(nl: Netlist, chunks: Finding[][], positions: number[][], out: Finding[]): void {
  let filled = 0;
  let total = 0;
  for (const c of chunks) {
    if (c.length) filled++;
    total += c.length;
  }
  if (filled <= 1) {
    for (const c of chunks) for (const x of c) out.push(x);
    return;
  }
  const slots = nl.sets.length * (nl.lines.length + 1) + 1;
  // Buffers kept between calls (evaluation is synchronous): the sweep merges once per state.
  if (startBuffer.length < slots + 1) startBuffer = new Int32Array(slots + 1);
  if (keyBuffer.length < total) keyBuffer = new Int32Array(Math.max(total, 2 * keyBuffer.length));
  const start = startBuffer;
  const keys = keyBuffer;
  start.fill(0, 0, slots + 1);
  let k = 0;
  for (const c of positions) for (const x of c) start[(keys[k++] = x) + 1]++;
  for (let i = 0; i < slots; i++) start[i + 1] += start[i];
  const base = out.length;
  out.length = base + total;
  k = 0;
  for (const c of chunks) for (const x of c) out[base + start[keys[k++]]++] = x;
}

/** The state rules in registry order (with facts.eventsOnly, only those a KSU event can raise). */
export function stateFindings(f: FindingFacts, rules: readonly StateRule[] = STATE_RULES): Finding[] {
  const out: Finding[] = [];
  let group: Finding[][] | null = null;
  let groupPositions: number[][] | null = null;
  for (const rule of rules) {
    if (f.eventsOnly && !rule.fires.event) continue;
    if (rule.bySet) {
      const found: Finding[] = [];
      const at: number[] = [];
      rule.find(f, found, at);
      (group ??= []).push(found);
      (groupPositions ??= []).push(at);
      continue;
    }
    if (group) {
      mergeBySet(f.nl, group, groupPositions!, out);
      group = groupPositions = null;
    }
    rule.find(f, out, NO_POSITIONS);
  }
  if (group) mergeBySet(f.nl, group, groupPositions!, out);
  f.finder?.release();
  return out;
}

const wiringCache = new WeakMap<Netlist, { plain?: Finding[]; withPaths?: Finding[] }>();

/**
 * The wiring rules' findings, made once per netlist with and once without paths, each when first asked for (an
 * evaluation with paths after an edit needs only those): the same objects in every state, which the sweep relies
 * on to key them once.
 */
export function wiringFindings(nl: Netlist, withPaths: boolean): Finding[] {
  let entry = wiringCache.get(nl);
  if (!entry) {
    entry = {};
    wiringCache.set(nl, entry);
  }
  if (!withPaths) return (entry.plain ??= WIRING_RULES.flatMap((r) => r.find(nl, false)));
  return (entry.withPaths ??= WIRING_RULES.flatMap((r) => r.find(nl, true)));
}

/** Every finding of one state: state rules, then wiring rules. */
export function allFindings(f: FindingFacts, withPaths: boolean): Finding[] {
  const dynamic = stateFindings(f);
  const fixed = wiringFindings(f.nl, withPaths);
  return fixed.length ? dynamic.concat(fixed) : dynamic;
}

/** False when no KSU event in this state can raise a finding whatever the sets do. */
export function eventMayAddFindings(state: Pick<SimState, 'lines' | 'intercom'>): boolean {
  for (const r of EVENT_RULES) if (r.eventMayAdd?.(state) ?? true) return true;
  return false;
}

/** The event rules that may raise a finding in this state with the sets' nets (registry order). */
export function eventRulesFor(state: SimState, on: { nl: Netlist; facts: NetFacts }): StateRule[] {
  return EVENT_RULES.filter((r) => r.eventMayAdd?.(state, on) ?? true);
}
