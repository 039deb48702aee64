/**
 * Cure: the smallest set of lead changes that clears every finding of the sweep and keeps plan.required working.
 * Method: ./README.md.
 */
import {
  applyActions,
  computeNets,
  evaluateFindings,
  evaluateWithNets,
  findSet,
  initialState,
  standardCrossConnect,
  type CrossConnect,
  type Finding,
  type Plan,
  type SimState,
} from './engine-port';
import { candidatesFor, type Candidate, type CureChange, type Problem } from './cure-candidates';
import { checkRequired, type RequiredFailure } from './required';
import { eventActions, stationPortOfSets, sweep, type SweepEvent, type SweepOptions } from './sweep';

export type { CureChange } from './cure-candidates';

export interface CureResult {
  ok: boolean;
  changes: CureChange[];
  before: Finding[];
  after: Finding[];
  /** Required functions that still fail after the changes (empty when ok). */
  requiredFailures: RequiredFailure[];
  proofOfMinimality: 'exhaustive' | 'heuristic';
  /** Sets of changes tried. */
  searched: number;
  message: string;
}

export interface CureOptions {
  /** Largest number of changes searched for (default 8). */
  maxChanges?: number;
  /** Largest number of change sets tried before giving up (default 10 000). */
  budget?: number;
  /** Passed to every sweep the cure runs. */
  sweep?: Pick<SweepOptions, 'strategy' | 'limit'>;
  shouldStop?: () => boolean;
}

/** The cure proves minimality exhaustively only up to this many sets (the sweep is exhaustive there). */
export const EXHAUSTIVE_CURE_SETS = 3;

/**
 * A state that showed a finding, remembered as its KSU event and the sets' positions, so it can be set up again on
 * every changed plan.
 */
interface Probe {
  event: SweepEvent;
  sets: SimState['sets'];
}

// ---------------------------------------------------------------------------------------------------------------
// Applying changes

export function withChanges(plan: Plan, changes: readonly CureChange[]): Plan {
  // Plans are never changed in place: the parts a change touches (and the KSU, when its cross-connect changes) are
  // copied, every other part is shared with the plan, and so is its wiring in the netlist (model/netlist.ts).
  const next: Plan = { ...plan, sets: plan.sets.slice(), addOns: plan.addOns.slice() };
  const copied = new Set<object>();
  const own = <T extends object>(list: T[], i: number): T => {
    if (!copied.has(list[i])) {
      list[i] = { ...list[i] };
      copied.add(list[i]);
    }
    return list[i];
  };
  const ownLeadPart = (id: string) => {
    const s = next.sets.findIndex((x) => x.id === id);
    if (s >= 0) return own(next.sets, s);
    const a = next.addOns.findIndex((x) => x.id === id);
    return a >= 0 ? own(next.addOns, a) : undefined;
  };
  for (const ch of changes) {
    const target = ownLeadPart(ch.part);
    if (!target) continue;
    target.leadChanges = [...target.leadChanges, ch.change];
    if (ch.crossConnect) {
      const added = ch.crossConnect;
      const gone = ch.replaces;
      const base = next.ksu.crossConnect ?? standardCrossConnect(next.ksu);
      const same = (x: CrossConnect, y: CrossConnect) =>
        x.port === y.port && x.pair === y.pair && JSON.stringify(x.lead) === JSON.stringify(y.lead);
      next.ksu = {
        ...next.ksu,
        crossConnect: [
          ...base.filter(
            (x) => !(x.port === added.port && x.pair === added.pair) && !(gone && same(x, gone)),
          ),
          added,
        ],
      };
    }
    if (ch.station) {
      const set = findSet(next, ch.part);
      if (set) own(next.sets, next.sets.indexOf(set)).station = ch.station;
    }
  }
  return next;
}

/** The plan with the cure's changes made: lead changes in the parts, cross-connect entries at the KSU. */
export function applyCure(plan: Plan, result: Pick<CureResult, 'changes'>): Plan {
  return withChanges(plan, result.changes);
}

// ---------------------------------------------------------------------------------------------------------------
// Search

function probeOf(event: SweepEvent, state: SimState): Probe {
  return { event, sets: state.sets };
}

/** One probe per finding code and sets: enough to reject most change sets before a full sweep. */
function probesOf(found: { finding: Finding; event: SweepEvent; state: SimState }[]): Probe[] {
  const seen = new Set<string>();
  const out: Probe[] = [];
  for (const f of found) {
    const key = `${f.finding.code}|${[...f.finding.sets].sort().join(',')}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push(probeOf(f.event, f.state));
  }
  return out;
}

/** A changed plan, with its event openings built on first use. */
class Trial {
  readonly plan: Plan;
  private readonly openings = new Map<string, SimState>();
  constructor(plan: Plan) {
    this.plan = plan;
  }

  /** The findings of a probe's state in this plan (sets in place over the event's opening, as the sweep does). */
  findings(probe: Probe, paths: boolean): Finding[] {
    const key = `${probe.event.held}|${probe.event.ringing}|${probe.event.intercom}`;
    let opening = this.openings.get(key);
    if (!opening) {
      opening = applyActions(this.plan, initialState(this.plan), eventActions(this.plan, probe.event));
      this.openings.set(key, opening);
    }
    const state = { ...opening, sets: probe.sets };
    const nets = computeNets(this.plan, state);
    return paths
      ? evaluateWithNets(this.plan, state, nets).findings
      : evaluateFindings(this.plan, state, nets);
  }
}

/**
 * Searches change sets by increasing size. A change set that still has a problem is extended only by candidates
 * that can touch that problem (a lead on its conductor path, or the buzzer of a set a station call misses); of the
 * change sets of the smallest size that pass everything, the cheapest wins.
 */
export function cure(plan: Plan, opts: CureOptions = {}): CureResult {
  const maxChanges = opts.maxChanges ?? 8;
  const budget = opts.budget ?? 10_000;
  const sweepOpts = opts.sweep ?? {};
  const ports = stationPortOfSets(plan);

  const first = sweep(plan, sweepOpts);
  const before = first.findings.map((f) => f.finding);
  const baseFailures = checkRequired(plan);
  let exhaustive =
    first.strategy === 'exhaustive' && first.complete && plan.sets.length <= EXHAUSTIVE_CURE_SETS;

  if (before.length === 0 && baseFailures.length === 0) {
    return {
      ok: true,
      changes: [],
      before,
      after: [],
      requiredFailures: [],
      proofOfMinimality: exhaustive ? 'exhaustive' : 'heuristic',
      searched: 1,
      message: 'Nothing to cure: the sweep found no faults and every required function works.',
    };
  }

  const probes = probesOf(first.findings);
  let searched = 0;
  let truncated = false;

  /** The problem of a change set with the fewest candidates, or null when it passes everything. */
  const problemOf = (
    trial: Trial,
  ): { problem: Problem | null; candidates: Candidate[]; after: Finding[]; failures: RequiredFailure[] } => {
    const pick = (problems: Problem[]) => {
      let best: { problem: Problem; candidates: Candidate[] } | null = null;
      for (const problem of problems) {
        const candidates = candidatesFor(trial.plan, problem, ports);
        if (!best || candidates.length < best.candidates.length) best = { problem, candidates };
        if (candidates.length === 0) break;
      }
      return best!;
    };
    for (let i = 0; i < probes.length; i++) {
      if (trial.findings(probes[i], false).length === 0) continue;
      const found = trial.findings(probes[i], true);
      // The probe that caught this change set is tried first on the next one.
      if (i > 0) probes.unshift(...probes.splice(i, 1));
      return { ...pick(found.map((finding) => ({ finding }))), after: found, failures: [] };
    }
    const failures = checkRequired(trial.plan);
    if (failures.length > 0)
      return { ...pick(failures.map((failure) => ({ failure }))), after: [], failures };
    const full = sweep(trial.plan, sweepOpts);
    if (!(full.strategy === 'exhaustive' && full.complete)) exhaustive = false;
    if (full.findings.length > 0) {
      probes.unshift(...probesOf(full.findings));
      const worst = full.findings[0];
      const here = full.findings.filter(
        (f) => f.stateSize === worst.stateSize && f.actions.length === worst.actions.length,
      );
      return {
        ...pick(here.map((f) => ({ finding: f.finding }))),
        after: full.findings.map((f) => f.finding),
        failures: [],
      };
    }
    return { problem: null, candidates: [], after: [], failures: [] };
  };

  type Node = Candidate[];
  let level: Node[] = [[]];
  const seen = new Set<string>(['']);
  let firstFailure: { after: Finding[]; failures: RequiredFailure[] } | null = null;

  for (let size = 0; size <= maxChanges && level.length > 0; size++) {
    const next: Node[] = [];
    // Cheapest change sets first: the first to pass at this size is the answer.
    level.sort((a, b) => totalRank(a) - totalRank(b) || nodeKey(a).localeCompare(nodeKey(b)));
    for (const node of level) {
      if (searched >= budget || opts.shouldStop?.()) {
        truncated = true;
        break;
      }
      searched++;
      const { problem, candidates, after, failures } = problemOf(new Trial(withChanges(plan, node)));
      if (!problem) {
        return {
          ok: true,
          changes: node.map(publicChange),
          before,
          after: [],
          requiredFailures: [],
          proofOfMinimality: exhaustive ? 'exhaustive' : 'heuristic',
          searched,
          message: `${node.length} lead change${node.length === 1 ? '' : 's'} clear every finding and keep the required functions.`,
        };
      }
      firstFailure ??= { after, failures };
      if (size === maxChanges) continue;
      for (const c of candidates) {
        if (node.some((n) => n.part === c.part && n.pair === c.pair)) continue;
        const child = [...node, c];
        const key = nodeKey(child);
        if (seen.has(key)) continue;
        seen.add(key);
        next.push(child);
      }
    }
    if (truncated) break;
    level = next;
  }

  return {
    ok: false,
    changes: [],
    before,
    after: firstFailure?.after ?? before,
    requiredFailures: firstFailure?.failures ?? baseFailures,
    proofOfMinimality: 'heuristic',
    searched,
    message: truncated
      ? `No cure found within ${searched} change sets; the search stopped early.`
      : `No cure of at most ${maxChanges} lead changes clears every finding while keeping the required functions.`,
  };
}

function totalRank(node: readonly Candidate[]): number {
  return node.reduce((sum, c) => sum + c.rank, 0);
}

function nodeKey(node: readonly Candidate[]): string {
  return node
    .map((c) => c.id)
    .sort()
    .join(' ');
}

export function publicChange(c: Candidate): CureChange {
  const out: CureChange = { part: c.part, change: c.change, cost: c.cost };
  if (c.crossConnect) out.crossConnect = c.crossConnect;
  if (c.replaces) out.replaces = c.replaces;
  if (c.station) out.station = c.station;
  return out;
}
