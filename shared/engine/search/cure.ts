/**
 * Cure: the smallest set of lead changes that clears every finding of the sweep and keeps plan.required working.
 * Method: ./README.md.
 */
import {
  applyAction,
  applyLeadChanges,
  computeNets,
  evaluateFindings,
  evaluateWithNets,
  getTemplate,
  initialState,
  standardCrossConnect,
  TEMPLATES,
  type CrossConnect,
  type Finding,
  type LeadChange,
  type Plan,
  type SimAction,
  type SimState,
} from './engine-port';
import { checkRequired, linesOfSet, type RequiredFailure } from './required';
import { eventActions, stationPortOfSets, sweep, type SweepEvent, type SweepOptions } from './sweep';

export interface CureChange {
  /** Id of the set or add-on the change is made in. */
  part: string;
  change: LeadChange;
  /** For a moved buzzer pair: the KSU cross-connect entry that feeds the new pair. */
  crossConnect?: CrossConnect;
  /** For a moved buzzer pair: the entry that fed the station on the old pair of that port, taken out. */
  replaces?: CrossConnect;
  /** For a moved buzzer pair sent to a station the set was not assigned to: the set's new station. */
  station?: string;
  /** What the change costs the user, in plain words. */
  cost: string;
}

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

export interface Candidate extends CureChange {
  id: string;
  /** The pair of the part this change touches (two changes on one pair of one part never combine). */
  pair: number;
  /** Relative cost, for choosing between change sets of the same size. */
  rank: number;
  kind: 'lift' | 'move';
}

/** A problem the current change set still has: a finding shown in some state, or a required function failing. */
export type Problem = { finding: Finding } | { failure: RequiredFailure };

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
  // A plan is plain JSON: a JSON round trip is its deep copy (and needs no DOM or Node global).
  const next = JSON.parse(JSON.stringify(plan)) as Plan;
  for (const ch of changes) {
    const target = next.sets.find((s) => s.id === ch.part) ?? next.addOns.find((a) => a.id === ch.part);
    if (!target) continue;
    target.leadChanges = [...target.leadChanges, ch.change];
    if (ch.crossConnect) {
      const added = ch.crossConnect;
      const gone = ch.replaces;
      const base = next.ksu.crossConnect ?? standardCrossConnect(next.ksu);
      const same = (x: CrossConnect, y: CrossConnect) =>
        x.port === y.port && x.pair === y.pair && JSON.stringify(x.lead) === JSON.stringify(y.lead);
      next.ksu.crossConnect = [
        ...base.filter((x) => !(x.port === added.port && x.pair === added.pair) && !(gone && same(x, gone))),
        added,
      ];
    }
    if (ch.station) {
      const set = next.sets.find((s) => s.id === ch.part);
      if (set) set.station = ch.station;
    }
  }
  return next;
}

/** The plan with the cure's changes made: lead changes in the parts, cross-connect entries at the KSU. */
export function applyCure(plan: Plan, result: Pick<CureResult, 'changes'>): Plan {
  return withChanges(plan, result.changes);
}

// ---------------------------------------------------------------------------------------------------------------
// Candidates

interface PartView {
  id: string;
  name: string;
  kind: 'set' | 'add-on';
  leads: { pair: number | null; conductor: 'tip' | 'ring'; scope: string; designation: string }[];
  /** For a set: whether an add-on serves it. */
  hasAddOn: boolean;
  /** For an add-on: the name of the set it serves. */
  servesName?: string;
}

function partView(plan: Plan, id: string): PartView | null {
  const set = plan.sets.find((s) => s.id === id);
  const addOn = plan.addOns.find((a) => a.id === id);
  const doc = set ?? addOn;
  const tpl = doc ? getTemplate(doc.template) : undefined;
  if (!doc || !tpl) return null;
  const at = applyLeadChanges(tpl.leads, doc.leadChanges);
  return {
    id,
    name: doc.name,
    kind: set ? 'set' : 'add-on',
    leads: tpl.leads.map((l, i) => ({
      pair: at[i],
      conductor: l.conductor,
      scope: l.scope,
      designation: l.designation,
    })),
    hasAddOn: set ? plan.addOns.some((a) => a.serves === id) : false,
    servesName: addOn ? (plan.sets.find((s) => s.id === addOn.serves)?.name ?? addOn.serves) : undefined,
  };
}

/** The line a bus lead belongs to, from its designation ("L6 A" → 6). */
function lineOfDesignation(designation: string): number | null {
  const m = /^L(\d+)\b/.exec(designation);
  return m ? Number(m[1]) : null;
}

function liftCost(plan: Plan, view: PartView, pair: number): { cost: string; rank: number } {
  const leads = view.leads.filter((l) => l.pair === pair);
  const scopes = new Set(leads.map((l) => l.scope));
  if (view.kind === 'add-on') {
    return { cost: `${view.name} no longer works for ${view.servesName}`, rank: 60 };
  }
  if (scopes.has('station')) return { cost: `${view.name} no longer buzzes for intercom calls`, rank: 80 };
  if (scopes.has('bus')) {
    const onKsu = new Set(plan.ksu.lines.map((l) => l.number));
    const lines = [...new Set(leads.map((l) => lineOfDesignation(l.designation)).filter((l) => l !== null))];
    const live = lines.filter((l) => onKsu.has(l));
    if (live.length > 0) return { cost: `${view.name} loses line ${live.join(' and ')}`, rank: 100 };
    return {
      cost: `none today: the KSU has no line ${lines.join(' or ')}; ${view.name} could not use it if one is added`,
      rank: 5,
    };
  }
  if (view.hasAddOn) return { cost: `${view.name} loses its hands-free connection`, rank: 50 };
  return { cost: `none: ${view.name} has no hands-free add-on (it can no longer take one)`, rank: 1 };
}

/**
 * Static check, no simulation: would lifting these leads take away something plan.required asks for?
 * A line lead of a line the set takes on the KSU, the buzzer of a set assigned to a station, the private leads of a
 * set (or add-on) whose hands-free must keep working.
 */
function liftBreaksRequired(plan: Plan, view: PartView, leads: PartView['leads']): boolean {
  const req = plan.required;
  if (view.kind === 'add-on') {
    const served = plan.addOns.find((a) => a.id === view.id)?.serves;
    return served !== undefined && req.handsFreeSets.includes(served);
  }
  const set = plan.sets.find((s) => s.id === view.id);
  if (!set) return false;
  const lines = new Set(linesOfSet(plan, set.id).map((l) => l.line));
  return leads.some(
    (l) =>
      (l.scope === 'bus' && req.allLinesOnEverySet && lines.has(lineOfDesignation(l.designation) ?? -1)) ||
      (l.scope === 'station' && req.intercomPerStation && set.station !== undefined) ||
      (l.scope === 'private' && req.handsFreeSets.includes(set.id)),
  );
}

/**
 * Lifting a pair in a set or add-on; a single lead only where lifting the whole pair would take away a required
 * function and lifting that lead alone would not.
 */
function liftCandidates(plan: Plan, partId: string, pair: number): Candidate[] {
  const view = partView(plan, partId);
  if (!view) return [];
  const here = view.leads.filter((l) => l.pair === pair);
  if (here.length === 0) return [];
  const { cost, rank } = liftCost(plan, view, pair);
  if (!liftBreaksRequired(plan, view, here)) {
    return [
      {
        id: `${partId}/lift/${pair}`,
        part: partId,
        pair,
        kind: 'lift',
        change: { kind: 'lift', pair, conductor: 'both' },
        cost,
        rank,
      },
    ];
  }
  if (here.length < 2) return [];
  return here
    .filter((lead) => !liftBreaksRequired(plan, view, [lead]))
    .map((lead) => ({
      id: `${partId}/lift/${pair}/${lead.conductor}`,
      part: partId,
      pair,
      kind: 'lift' as const,
      change: { kind: 'lift' as const, pair, conductor: lead.conductor },
      cost,
      rank: rank + 0.5,
    }));
}

const PAIRS_IN_TEMPLATES = new Set(TEMPLATES.flatMap((t) => t.leads.map((l) => l.pair)));

/** Moves of a set's buzzer pair to a spare pair, each with the KSU cross-connect entry that feeds it. */
function moveCandidates(plan: Plan, setId: string, ports: number[]): Candidate[] {
  const setIndex = plan.sets.findIndex((s) => s.id === setId);
  const view = partView(plan, setId);
  const port = ports[setIndex];
  if (!view || setIndex < 0 || port < 1) return [];
  const fromPairs = [
    ...new Set(view.leads.filter((l) => l.scope === 'station' && l.pair !== null).map((l) => l.pair!)),
  ];
  if (fromPairs.length === 0) return [];
  // Spare: no lead of any set or add-on on this station port uses it, and the KSU puts nothing on it there.
  const used = new Set<number>();
  plan.sets.forEach((s, i) => {
    if (ports[i] !== port) return;
    for (const l of partView(plan, s.id)?.leads ?? []) if (l.pair !== null) used.add(l.pair);
    for (const a of plan.addOns.filter((x) => x.serves === s.id)) {
      for (const l of partView(plan, a.id)?.leads ?? []) if (l.pair !== null) used.add(l.pair);
    }
  });
  for (const x of plan.ksu.crossConnect ?? standardCrossConnect(plan.ksu))
    if (x.port === port) used.add(x.pair);
  const assignedElsewhere = new Set(
    plan.sets.filter((s) => s.id !== setId && s.station).map((s) => s.station),
  );
  const own = plan.sets[setIndex].station;
  const stations = plan.ksu.stations
    .map((s) => s.id)
    .filter((id) => id === own || (!own && !assignedElsewhere.has(id)));
  const crossConnect = plan.ksu.crossConnect ?? standardCrossConnect(plan.ksu);
  // Names of the other sets on this port whose buzzer is on each pair.
  const stayingOn = new Map<number, string[]>();
  plan.sets.forEach((s, i) => {
    if (i === setIndex || ports[i] !== port) return;
    for (const l of partView(plan, s.id)?.leads ?? []) {
      if (l.scope !== 'station' || l.pair === null || l.conductor !== 'tip') continue;
      stayingOn.set(l.pair, [...(stayingOn.get(l.pair) ?? []), s.name]);
    }
  });
  const out: Candidate[] = [];
  for (const from of fromPairs) {
    for (let to = 1; to <= 25; to++) {
      if (used.has(to)) continue;
      for (const station of stations) {
        // The station's output on the old pair of this port goes with the set to the new pair.
        const replaces = crossConnect.find(
          (x) => x.port === port && x.pair === from && x.lead.kind === 'buzzer' && x.lead.station === station,
        );
        // Sets left on the old pair lose their buzzer when that was the last station output on it.
        const stillFed = crossConnect.some(
          (x) => x.port === port && x.pair === from && x.lead.kind === 'buzzer' && x !== replaces,
        );
        const stranded = replaces && !stillFed ? (stayingOn.get(from) ?? []) : [];
        const code = plan.ksu.stations.find((s) => s.id === station)?.code ?? station;
        const strandedText = stranded.length
          ? `; ${stranded.join(' and ')} ${stranded.length === 1 ? 'stays' : 'stay'} on pair ${from}, which no station feeds any more`
          : '';
        out.push({
          replaces,
          id: `${setId}/move/${from}/${to}/${station}`,
          part: setId,
          pair: from,
          kind: 'move',
          change: { kind: 'move', pair: from, toPair: to },
          crossConnect: { port, pair: to, lead: { kind: 'buzzer', station } },
          station: station === own ? undefined : station,
          cost: stranded.length
            ? `spare pair ${to}, cross-connected at the KSU to station ${code}${strandedText}`
            : `none: spare pair ${to}, cross-connected at the KSU to station ${code}`,
          // Pairs no shipped template uses first (nothing added to this cable later can land on them), then
          // lower pairs first, so the same plan always gets the same pair. Stranding other buzzers costs more.
          rank: 2 + (PAIRS_IN_TEMPLATES.has(to) ? 0.5 : 0) + to / 1000 + 40 * stranded.length,
        });
      }
    }
  }
  return out;
}

/** Candidates for clearing one problem, taken from its conductor path or, for required functions, its sets. */
export function candidatesFor(plan: Plan, problem: Problem, ports: number[]): Candidate[] {
  const out: Candidate[] = [];
  const isPart = (id: string) => plan.sets.some((s) => s.id === id) || plan.addOns.some((a) => a.id === id);
  const everyLeadOf = (setIds: string[]) => {
    for (const id of setIds) {
      for (const part of [id, ...plan.addOns.filter((a) => a.serves === id).map((a) => a.id)]) {
        for (const pair of new Set(partView(plan, part)?.leads.map((l) => l.pair) ?? [])) {
          if (pair !== null) out.push(...liftCandidates(plan, part, pair));
        }
      }
    }
  };
  if ('finding' in problem) {
    const { finding } = problem;
    for (const hop of finding.path) {
      if (hop.pair === undefined || !isPart(hop.part)) continue;
      out.push(...liftCandidates(plan, hop.part, hop.pair));
    }
    // No conductor path to follow (e.g. a line held aside): any lead of the sets involved, or of every set.
    if (finding.path.length === 0)
      everyLeadOf(finding.sets.length > 0 ? finding.sets : plan.sets.map((s) => s.id));
    if (finding.code === 'INTERCOM_SOUNDS_SEVERAL') {
      for (const id of finding.sets) out.push(...moveCandidates(plan, id, ports));
    }
  } else {
    const sets = problem.failure.sets.length > 0 ? problem.failure.sets : plan.sets.map((s) => s.id);
    if (problem.failure.function === 'intercomPerStation') {
      for (const id of sets) out.push(...moveCandidates(plan, id, ports));
    }
    // Lifting only takes connections away: it can cure something extra, never something missing.
    if (problem.failure.kind === 'extra') everyLeadOf(sets);
  }
  const seen = new Set<string>();
  return out.filter((c) => !seen.has(c.id) && seen.add(c.id));
}

// ---------------------------------------------------------------------------------------------------------------
// Search

function applyAll(plan: Plan, state: SimState, actions: readonly SimAction[]): SimState {
  let s = state;
  for (const a of actions) s = applyAction(plan, s, a);
  return s;
}

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
      opening = applyAll(this.plan, initialState(this.plan), eventActions(this.plan, probe.event));
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
