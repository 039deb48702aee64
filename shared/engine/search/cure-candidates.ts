/**
 * The cure's candidate changes and what each costs: lifts of the leads a problem's conductor path (or its sets)
 * uses, and moves of a set's buzzer pair to a spare pair with the KSU cross-connect entry that feeds it.
 * Method: ./README.md (Cure: Changes, Candidates, Static checks, Costs).
 */
import {
  findAddOn,
  findLeadPart,
  findSet,
  liftCost,
  lineOfDesignation,
  partLeads,
  standardCrossConnect,
  stationCode,
  TEMPLATES,
  type CrossConnect,
  type Finding,
  type LeadChange,
  type PartLeads,
  type PlacedLead,
  type Plan,
} from './engine-port';
import { linesOfSet, type RequiredFailure } from './required';

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
 * Static check, no simulation: would lifting these leads take away something plan.required asks for?
 * A line lead of a line the set takes on the KSU, the buzzer of a set assigned to a station, the private leads of a
 * set (or add-on) whose hands-free must keep working.
 */
function liftBreaksRequired(plan: Plan, view: PartLeads, leads: readonly PlacedLead[]): boolean {
  const req = plan.required;
  if (view.kind === 'add-on') {
    const served = findAddOn(plan, view.part.id)?.serves;
    return served !== undefined && req.handsFreeSets.includes(served);
  }
  const set = findSet(plan, view.part.id);
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
export function liftCandidates(plan: Plan, partId: string, pair: number): Candidate[] {
  let byPair = liftCache.get(plan);
  if (!byPair) liftCache.set(plan, (byPair = new Map()));
  const key = `${partId}|${pair}`;
  let out = byPair.get(key);
  if (!out) byPair.set(key, (out = liftCandidatesOf(plan, partId, pair)));
  // Copies: a caller may keep or change what it is given (a cure's result holds its changes).
  return out.map((c) => ({ ...c, change: { ...c.change } }));
}

/** liftCandidates per plan object, part and pair: a cure asks again for every finding whose path crosses a lead. */
const liftCache = new WeakMap<Plan, Map<string, readonly Candidate[]>>();

function liftCandidatesOf(plan: Plan, partId: string, pair: number): Candidate[] {
  const view = partLeads(plan, partId);
  if (!view) return [];
  const here = view.leads.filter((l) => l.pair === pair);
  if (here.length === 0) return [];
  const { brief: cost, rank } = liftCost(plan, view.part, here);
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
export function moveCandidates(plan: Plan, setId: string, ports: number[]): Candidate[] {
  const setIndex = plan.sets.findIndex((s) => s.id === setId);
  const view = partLeads(plan, setId);
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
    for (const l of partLeads(plan, s.id)?.leads ?? []) if (l.pair !== null) used.add(l.pair);
    for (const a of plan.addOns.filter((x) => x.serves === s.id)) {
      for (const l of partLeads(plan, a.id)?.leads ?? []) if (l.pair !== null) used.add(l.pair);
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
    for (const l of partLeads(plan, s.id)?.leads ?? []) {
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
        const code = stationCode(plan, station);
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

/** Every lift candidate in these sets and the add-ons serving them. */
export function liftsOf(plan: Plan, setIds: readonly string[]): Candidate[] {
  const out: Candidate[] = [];
  for (const id of setIds) {
    for (const part of [id, ...plan.addOns.filter((a) => a.serves === id).map((a) => a.id)]) {
      for (const pair of new Set(partLeads(plan, part)?.leads.map((l) => l.pair) ?? [])) {
        if (pair !== null) out.push(...liftCandidates(plan, part, pair));
      }
    }
  }
  return out;
}

/**
 * Candidates for clearing one problem, taken from its conductor path or, for required functions, its sets. Every
 * finding with a path (joined lines, a line on a control lead, ringing over joined lines, …) gets the lifts of the
 * set and add-on leads on it; the intercom finding also gets buzzer moves.
 */
export function candidatesFor(plan: Plan, problem: Problem, ports: number[]): Candidate[] {
  const out: Candidate[] = [];
  const isPart = (id: string) => findLeadPart(plan, id) !== undefined;
  const everyLeadOf = (setIds: string[]) => out.push(...liftsOf(plan, setIds));
  if ('finding' in problem) {
    const { finding } = problem;
    const movesOf = new Map<string, Candidate[]>();
    const movesOfSet = (id: string) => {
      if (!movesOf.has(id)) movesOf.set(id, moveCandidates(plan, id, ports));
      return movesOf.get(id)!;
    };
    for (const hop of finding.path) {
      // At the KSU the path runs over a cross-connect entry: a buzzer move that takes the station's output off that
      // pair (with the set it goes to) breaks it there.
      if (hop.part === plan.ksu.id && hop.pair !== undefined && hop.port !== undefined) {
        const port = Number(/(\d+)$/.exec(hop.port)?.[1] ?? -1);
        plan.sets.forEach((set, i) => {
          if (ports[i] !== port) return;
          out.push(...movesOfSet(set.id).filter((c) => c.pair === hop.pair && c.replaces));
        });
        continue;
      }
      if (hop.pair === undefined || !isPart(hop.part)) continue;
      out.push(...liftCandidates(plan, hop.part, hop.pair));
      // Moving a set's buzzer lead off the pair breaks the path there as a lift does, and keeps the buzzer.
      if (findSet(plan, hop.part)) out.push(...movesOfSet(hop.part).filter((c) => c.pair === hop.pair));
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
