/**
 * Sweep: operate a plan in every reachable combination of set states and KSU events and collect what goes wrong.
 * Method and limits: ./README.md.
 */
import {
  applyActions,
  findingKey,
  computeNetsInto,
  createMechFor,
  evaluate,
  evaluateFindings,
  evaluateFindingsWithPaths,
  eventFindings,
  eventMayAddFindings,
  getTemplate,
  initialState,
  RULES,
  type Finding,
  type Plan,
  type SimAction,
  type SimState,
} from './engine-port';
import { planSoundSweep } from './sound-sweep';

/** Codes of the wiring rules: findings wrong in every state, read off the netlist once. */
const WIRING_CODES: ReadonlySet<string> = new Set(
  Object.values(RULES)
    .filter((r) => r.kind === 'wiring')
    .map((r) => r.code),
);

export type SweepStrategy = 'exhaustive' | 'reduced';

/** How the default sweep covered the states (see README, "Sound sweep"). */
export interface SweepReduction {
  /** Groups of interchangeable sets (ids), each visited as a multiset of positions. */
  symmetric: string[][];
  /** Mechanical combinations the exhaustive sweep would visit. */
  exhaustiveCombinations: number;
}

/**
 * Largest number of states the sweep visits exhaustively. Three six-key sets with one hands-free add-on and a
 * five-line, three-station KSU come to 12 × 12 × 24 mechanical states × 14 events = 48 384 states.
 */
export const EXHAUSTIVE_STATE_LIMIT = 60_000;

export interface SweepOptions {
  /** Called every few hundred states and once at the end. */
  onProgress?: (done: number, total: number) => void;
  /** Polled every few dozen states; returning true ends the sweep early (complete: false). */
  shouldStop?: () => boolean;
  /** Visit at most this many states. */
  limit?: number;
  /** 'auto' (default) picks exhaustive when the state count is at most EXHAUSTIVE_STATE_LIMIT. */
  strategy?: 'auto' | SweepStrategy;
  /**
   * 'single' (default): at most one KSU event at a time (a ringing line, an intercom call or a held line).
   * 'product': every combination of ringing line × intercom call × held line; slower, for cross-checks.
   */
  events?: 'single' | 'product';
  /**
   * Reach every state through applyAction and evaluate it from scratch (slow; the reference the fast path is
   * tested against).
   */
  exact?: boolean;
}

/** One finding, with the smallest state found that shows it and the actions that reach that state. */
export interface SweptFinding {
  finding: Finding;
  state: SimState;
  /** Active elements in the state: sets off-hook, keys latched, hands-free on, ringing line, intercom call, held line. */
  stateSize: number;
  /** Applied in order to initialState(plan), these reach `state`. */
  actions: SimAction[];
  /** The KSU event of the state (what happened before the sets moved). */
  event: SweepEvent;
}

export interface SweepResult {
  strategy: SweepStrategy;
  statesVisited: number;
  /** States the chosen strategy would visit in full. */
  statesPlanned: number;
  /** False when shouldStop or limit ended the sweep before every planned state was visited. */
  complete: boolean;
  findings: SweptFinding[];
  /** When complete is false: why, in plain words. */
  incompleteReason?: string;
  /** The exact reductions the default sweep used (absent for the exhaustive and reduced strategies). */
  reduction?: SweepReduction;
  /**
   * When a plan too large for a complete sweep was proved to show no state's finding (search/clean-proof.ts): why,
   * in plain words. The sweep is then complete: its findings are the wiring findings, from the idle state alone.
   */
  cleanProof?: string;
}

/** One set's mechanical position. */
export interface SetMove {
  offHook: boolean;
  key: number | null;
  handsFree: boolean;
}

/** What the KSU and the far end do, applied before the sets move. */
export interface SweepEvent {
  held: number | null;
  ringing: number | null;
  intercom: string | null;
}

function moveSize(m: SetMove): number {
  return (m.offHook ? 1 : 0) + (m.key === null ? 0 : 1) + (m.handsFree ? 1 : 0);
}

function eventSize(e: SweepEvent): number {
  return (e.held === null ? 0 : 1) + (e.ringing === null ? 0 : 1) + (e.intercom === null ? 0 : 1);
}

/** Every position of one set, idle first and then by increasing size. */
export function setMoves(plan: Plan, setIndex: number): SetMove[] {
  const set = plan.sets[setIndex];
  const keys = (getTemplate(set.template)?.keys ?? []).filter((k) => k.kind === 'line').map((k) => k.index);
  const handsFree = plan.addOns.some((a) => a.serves === set.id) ? [false, true] : [false];
  const out: SetMove[] = [];
  for (const hf of handsFree) {
    for (const key of [null, ...keys]) {
      for (const offHook of [false, true]) out.push({ offHook, key, handsFree: hf });
    }
  }
  return out.sort((a, b) => moveSize(a) - moveSize(b));
}

/** The actions that take one idle set to a position. */
function moveActions(setId: string, m: SetMove): SimAction[] {
  const out: SimAction[] = [];
  if (m.handsFree) out.push({ kind: 'hands-free', set: setId, on: true });
  if (m.key !== null) out.push({ kind: 'press-key', set: setId, key: m.key });
  if (m.offHook) out.push({ kind: 'lift-handset', set: setId });
  return out;
}

/** A set that can put a line on hold: it has a key for the line and a hold key. */
function holdActions(plan: Plan, line: number): SimAction[] | null {
  for (const set of plan.sets) {
    const keys = getTemplate(set.template)?.keys ?? [];
    const lineKey = keys.find((k) => k.kind === 'line' && k.line === line);
    if (lineKey && keys.some((k) => k.kind === 'hold')) {
      return [
        { kind: 'press-key', set: set.id, key: lineKey.index },
        { kind: 'lift-handset', set: set.id },
        { kind: 'press-hold', set: set.id },
        { kind: 'hang-up', set: set.id },
      ];
    }
  }
  return null;
}

/** The actions that make an event happen, from the initial state. */
export function eventActions(plan: Plan, e: SweepEvent): SimAction[] {
  const out: SimAction[] = [];
  if (e.held !== null) out.push(...(holdActions(plan, e.held) ?? []));
  if (e.ringing !== null) out.push({ kind: 'ring-line', line: e.ringing });
  if (e.intercom !== null) out.push({ kind: 'intercom-call', station: e.intercom });
  return out;
}

/** The KSU events of a sweep, 'none' first. Held lines are only those some set can hold. */
export function sweepEvents(plan: Plan, mode: 'single' | 'product' = 'single'): SweepEvent[] {
  const lines = plan.ksu.lines.map((l) => l.number);
  const holdable = lines.filter((l) => holdActions(plan, l) !== null);
  const stations = plan.ksu.stations.map((s) => s.id);
  const none: SweepEvent = { held: null, ringing: null, intercom: null };
  if (mode === 'single') {
    return [
      none,
      ...lines.map((ringing) => ({ ...none, ringing })),
      ...stations.map((intercom) => ({ ...none, intercom })),
      ...holdable.map((held) => ({ ...none, held })),
    ];
  }
  const out: SweepEvent[] = [];
  for (const held of [null, ...holdable]) {
    for (const ringing of [null, ...lines.filter((l) => l !== held)]) {
      for (const intercom of [null, ...stations]) out.push({ held, ringing, intercom });
    }
  }
  return out.sort((a, b) => eventSize(a) - eventSize(b));
}

/**
 * Mechanical combinations (one move index per set) in increasing total size, each handed to `visit` (one array,
 * changed after the call returns: a visitor that keeps a combination copies it); visiting ends early when it
 * returns false. maxActive limits how many sets may leave idle (the reduced
 * strategy); groups, when given, say which sets may be active together (sets on the same KSU station port).
 * Recursion with a callback rather than nested generators: with 40 sets every combination would otherwise pass
 * through 40 delegating generators.
 */
function forEachCombination(
  moves: SetMove[][],
  maxActive: number,
  sameGroup: (i: number, j: number) => boolean,
  visit: (combo: readonly number[]) => boolean,
): void {
  const n = moves.length;
  const sizes = moves.map((ms) => ms.map(moveSize));
  // Every entry from the set being filled on is 0 (each level puts its entry back), so a spent budget is a
  // finished combination.
  const combo = new Array<number>(n).fill(0);
  // Largest size the sets from i on can still add, for pruning.
  const rest = new Array<number>(n + 1).fill(0);
  // Largest size one set from i on can add: the sets still allowed to leave idle add at most that much each.
  const largest = new Array<number>(n + 1).fill(0);
  for (let i = n - 1; i >= 0; i--) {
    const most = Math.max(...sizes[i]);
    rest[i] = rest[i + 1] + most;
    largest[i] = Math.max(largest[i + 1], most);
  }
  const active: number[] = [];

  function fill(i: number, budget: number): boolean {
    if (budget === 0) return visit(combo);
    // Pruned: no combination from here spends the budget (the walk would otherwise go on set by set).
    if (i === n || budget > rest[i] || budget > (maxActive - active.length) * largest[i]) return true;
    if (!fill(i + 1, budget)) return false;
    if (active.some((j) => !sameGroup(i, j))) return true;
    for (let m = 1; m < moves[i].length; m++) {
      const s = sizes[i][m];
      if (s > budget) continue;
      combo[i] = m;
      active.push(i);
      const go = fill(i + 1, budget - s);
      active.pop();
      combo[i] = 0;
      if (!go) return false;
    }
    return true;
  }
  for (let size = 0; size <= rest[0]; size++) if (!fill(0, size)) return;
}

function countCombinations(
  moves: SetMove[][],
  maxActive: number,
  sameGroup: (i: number, j: number) => boolean,
): number {
  if (maxActive >= moves.length) return moves.reduce((p, ms) => p * ms.length, 1);
  // maxActive is 1 or 2 here: none, one set, or two sets of one group.
  let total = 1;
  for (let i = 0; i < moves.length; i++) {
    total += moves[i].length - 1;
    if (maxActive < 2) continue;
    for (let j = i + 1; j < moves.length; j++) {
      if (sameGroup(i, j)) total += (moves[i].length - 1) * (moves[j].length - 1);
    }
  }
  return total;
}

/**
 * The KSU station port each set's cord reaches through cables, adapters and add-ons (-1 when it reaches none).
 * Sets on different ports only meet inside the KSU line circuits, which the single-set states already cover.
 */
export function stationPortOfSets(plan: Plan): number[] {
  const adjacent = new Map<string, string[]>();
  const link = (a: string, b: string) => {
    adjacent.set(a, [...(adjacent.get(a) ?? []), b]);
    adjacent.set(b, [...(adjacent.get(b) ?? []), a]);
  };
  for (const c of plan.cables) {
    const from = c.from.part === plan.ksu.id ? `${c.from.part}/${c.from.port}` : c.from.part;
    const to = c.to.part === plan.ksu.id ? `${c.to.part}/${c.to.port}` : c.to.part;
    link(from, to);
  }
  const portNumber = (node: string) => Number(/(\d+)$/.exec(node)?.[1] ?? -1);
  return plan.sets.map((set) => {
    const seen = new Set([set.id]);
    const queue = [set.id];
    while (queue.length > 0) {
      const node = queue.shift()!;
      if (node.startsWith(`${plan.ksu.id}/`)) return portNumber(node);
      for (const next of adjacent.get(node) ?? []) {
        if (!seen.has(next)) {
          seen.add(next);
          queue.push(next);
        }
      }
    }
    return -1;
  });
}

const NONE: readonly Finding[] = [];
/** In the sweep's table of wiring findings' keys: this one is kept at size 0 already. */
const SETTLED = '';

export interface Planned {
  strategy: SweepStrategy;
  /** Visits the combinations instead of forEachCombination (the sound sweep's multisets), as it does. */
  forEach?: (visit: (combo: readonly number[]) => boolean) => void;
  /**
   * Every combination equivalent to a visited one (the visited one first) with the permutation of set indices
   * that maps it there: perm[i] is where set i goes.
   */
  images?: (combo: readonly number[]) => { combo: number[]; perm: number[] }[];
  reduction?: SweepReduction;
  /** Set when the plan is too large for a complete sweep. */
  incompleteReason?: string;
  /** Set when no state can show a state rule's finding (the clean proof's words): only the idle state is visited. */
  cleanProof?: string;
  moves: SetMove[][];
  events: SweepEvent[];
  maxActive: number;
  sameGroup: (i: number, j: number) => boolean;
  /** Mechanical combinations to visit. */
  combinations: number;
  /** Of those, the ones visited with no KSU event only (two sets active in the reduced strategy). */
  withoutEvents: number;
  total: number;
}

/** Decides the strategy and counts the states it will visit. */
export function planSweep(plan: Plan, opts: Pick<SweepOptions, 'strategy' | 'events'> = {}): Planned {
  const moves = plan.sets.map((_, i) => setMoves(plan, i));
  const events = sweepEvents(plan, opts.events);
  const anyGroup = () => true;
  const all = countCombinations(moves, moves.length, anyGroup);
  const wanted = opts.strategy ?? 'auto';
  if (wanted === 'exhaustive' || (wanted === 'auto' && all * events.length <= EXHAUSTIVE_STATE_LIMIT)) {
    const maxActive = moves.length;
    return {
      strategy: 'exhaustive',
      moves,
      events,
      maxActive,
      sameGroup: anyGroup,
      combinations: all,
      withoutEvents: 0,
      total: all * events.length,
    };
  }
  const ports = stationPortOfSets(plan);
  const sameGroup = (i: number, j: number) => ports[i] === ports[j];
  const upToOne = countCombinations(moves, 1, sameGroup);
  const pairs = countCombinations(moves, 2, sameGroup) - upToOne;
  return {
    strategy: 'reduced',
    moves,
    events,
    maxActive: 2,
    sameGroup,
    combinations: upToOne + pairs,
    withoutEvents: pairs,
    total: upToOne * events.length + pairs,
  };
}

/**
 * Visits the planned states and returns each distinct finding (code + sets + lines + stations) once, with the
 * smallest state that shows it.
 */
export function sweep(plan: Plan, opts: SweepOptions = {}): SweepResult {
  const sound = (opts.strategy ?? 'auto') === 'auto' && !opts.exact;
  return runSweep(plan, opts, sound ? planSoundSweep(plan, opts) : planSweep(plan, opts));
}

/** Visits the planned states; the default (sound) sweep hands in its own plan (sound-sweep.ts). */
export function runSweep(plan: Plan, opts: SweepOptions, planned: Planned): SweepResult {
  const { moves, events } = planned;
  const limit = opts.limit ?? Number.POSITIVE_INFINITY;
  const start = initialState(plan);

  // Each event's opening state, built once; events that leave the plan where 'none' does are skipped.
  const seenOpenings = new Set<string>();
  const openings: {
    event: SweepEvent;
    actions: SimAction[];
    state: SimState;
    size: number;
    /** Whether the event can add findings to the idle opening's (eventMayAddFindings). */
    mayAdd: boolean;
  }[] = [];
  for (const event of events) {
    const actions = eventActions(plan, event);
    const state = applyActions(plan, start, actions);
    const key = JSON.stringify(state);
    if (seenOpenings.has(key)) continue;
    seenOpenings.add(key);
    openings.push({ event, actions, state, size: eventSize(event), mayAdd: eventMayAddFindings(state) });
  }
  // sweepEvents puts 'none' first: the opening with no event is initialState itself.
  const idleFirst = openings.length > 0 && openings[0].size === 0;
  const withEvents = planned.combinations - planned.withoutEvents;
  const planTotal = withEvents * openings.length + planned.withoutEvents;
  const total = Math.min(planTotal, limit);

  // Per finding key: the smallest state so far, as the opening and the combination that make it.
  const best = new Map<string, { finding: Finding; size: number; opening: number; combo: number[] }>();
  let visited = 0;
  let stopped = false;
  const setIds = plan.sets.map((s) => s.id);
  // Findings the core hands back as the same objects in every state (the wiring ones): their keys once.
  const idle = evaluate(plan, start, { paths: false }).findings;
  const again = new Set(evaluate(plan, start, { paths: false }).findings);
  const knownKeys = new Map(idle.filter((f) => again.has(f)).map((f) => [f, findingKey(f)]));
  const comboActions = (combo: readonly number[]): SimAction[] =>
    combo.flatMap((m, i) => (m === 0 ? [] : moveActions(setIds[i], moves[i][m])));

  // Each set's position as a SetState, shared by every combination (the evaluation only reads them).
  const moveStates = moves.map((ms) =>
    ms.map((m) => ({ offHook: m.offHook, pressedKey: m.key, handsFreeOn: m.handsFree })),
  );
  // One mechanical state buffer for the whole sweep: a combination's nets are dropped before the next one's.
  const mechBuffer = opts.exact ? null : createMechFor(plan);

  // One SetState record for every combination, changed in place (the evaluation only reads it and keeps nothing
  // of it), and each opening's state around it, so that a visited state allocates nothing here.
  const sets: SimState['sets'] = {};
  const shown = new Array<number>(setIds.length).fill(0);
  setIds.forEach((id, i) => (sets[id] = moveStates[i][0]));
  const netsState: SimState = { ...start, sets };
  const openingStates = openings.map((o) => ({ ...o.state, sets }));
  const sizeOf = moves.map((ms) => ms.map(moveSize));

  const visitCombination = (combo: readonly number[]): boolean => {
    let comboSize = 0;
    let active = 0;
    for (let i = 0; i < combo.length; i++) {
      const m = combo[i];
      if (shown[i] !== m) {
        sets[setIds[i]] = moveStates[i][m];
        shown[i] = m;
      }
      comboSize += sizeOf[i][m];
      if (m !== 0) active++;
    }
    // The combination as kept in best: copied once, when a finding first keeps it.
    let kept: number[] | null = null;
    // Reduced strategy: two sets together are visited without KSU events (see README).
    const openingCount = planned.strategy === 'reduced' && active > 1 ? 1 : openings.length;
    // The sets' positions fix every contact, so the nets are solved once for all events.
    const nets = mechBuffer ? computeNetsInto(plan, netsState, mechBuffer) : null;
    const actions = opts.exact ? comboActions(combo) : null;
    for (let o = 0; o < openingCount; o++) {
      if (visited >= limit || (visited % 64 === 0 && opts.shouldStop?.())) {
        stopped = true;
        return false;
      }
      const opening = openings[o];
      // Moving from idle only closes contacts, so no line changes circuit on the way: the opening's line states
      // with the sets in place show the same findings as the settled state (the tests check this against exact
      // mode). The kept states are replayed exactly below.
      // The idle opening (the first) gives every finding the sets' positions decide, at the smallest size any
      // opening has; the others are asked only for what their event adds (eventFindings).
      const found = nets
        ? o === 0 || !idleFirst
          ? evaluateFindings(plan, openingStates[o], nets)
          : opening.mayAdd
            ? eventFindings(plan, openingStates[o], nets)
            : NONE
        : evaluate(plan, applyActions(plan, opening.state, actions!), { paths: false }).findings;
      visited++;
      const size = opening.size + comboSize;
      for (let k = 0; k < found.length; k++) {
        const f = found[k];
        const knownKey = knownKeys.get(f);
        // A wiring finding kept at size 0 stays there: no state is smaller.
        if (knownKey === SETTLED) continue;
        const key = knownKey ?? findingKey(f);
        const known = best.get(key);
        if (known === undefined || known.size > size) {
          kept ??= combo.slice();
          best.set(key, { finding: f, size, opening: o, combo: kept });
          if (size === 0 && knownKey !== undefined) knownKeys.set(f, SETTLED);
        }
      }
      if (visited % 256 === 0) opts.onProgress?.(visited, total);
    }
    return true;
  };
  if (planned.forEach) planned.forEach(visitCombination);
  else forEachCombination(moves, planned.maxActive, planned.sameGroup, visitCombination);
  opts.onProgress?.(visited, total);

  // Interchangeable sets: each finding of a visited combination stands for its images under the permutations of
  // those sets, in the image combination and at the same size (README, "Sound sweep"). A wiring finding has none:
  // it is read off the whole netlist in the idle state, exactly, and names the parts its conductors run through,
  // which two sets on the same nets by different routes (a port of their own, an adapter shared) do not share.
  if (planned.images) {
    const ids = plan.sets.map((s) => s.id);
    const addOnsOf = new Map<string, string[]>();
    for (const a of plan.addOns) addOnsOf.set(a.serves, [...(addOnsOf.get(a.serves) ?? []), a.id]);
    for (const [, entry] of [...best]) {
      if (WIRING_CODES.has(entry.finding.code)) continue;
      for (const image of planned.images(entry.combo).slice(1)) {
        // Sets trade places together with the add-ons serving them (findings name add-ons too).
        const rename = new Map<string, string>();
        ids.forEach((id, i) => {
          const to = ids[image.perm[i]];
          rename.set(id, to);
          const mine = addOnsOf.get(id) ?? [];
          const theirs = addOnsOf.get(to) ?? [];
          mine.forEach((a, k) => rename.set(a, theirs[k] ?? a));
        });
        const finding = { ...entry.finding, sets: entry.finding.sets.map((id) => rename.get(id) ?? id) };
        const key = findingKey(finding);
        const known = best.get(key);
        if (known === undefined || known.size > entry.size)
          best.set(key, { finding, size: entry.size, opening: entry.opening, combo: image.combo });
      }
    }
  }

  // applyAction is pure, so a state is reached as well from the state its first actions reach: the opening's state,
  // then the states after each set's moves, shared between the kept states that begin alike. Each kept state is
  // still a new object, as when its actions are applied one by one from the start.
  const prefixStates = new Map<string, SimState>();
  const replay = (o: number, combo: number[]): SimState => {
    const opening = openings[o];
    let last = combo.length - 1;
    while (last >= 0 && combo[last] === 0) last--;
    if (last < 0) return applyActions(plan, start, opening.actions);
    let state = opening.state;
    let key = String(o);
    for (let i = 0; i < last; i++) {
      key += `,${combo[i]}`;
      if (combo[i] === 0) continue;
      let next = prefixStates.get(key);
      if (!next) {
        next = applyActions(plan, state, moveActions(setIds[i], moves[i][combo[i]]));
        prefixStates.set(key, next);
      }
      state = next;
    }
    return applyActions(plan, state, moveActions(setIds[last], moves[last][combo[last]]));
  };

  // The kept states, reached by their actions, evaluated once more for their findings with paths and sentences
  // (observations are not needed), once per distinct state. The opening's state is its actions applied to the start
  // already; findings that share a state share its evaluation.
  const kept: { swept: SweptFinding; key: string }[] = [];
  const evaluated = new Map<string, Map<string, Finding>>();
  for (const [key, entry] of best) {
    const opening = openings[entry.opening];
    const actions = [...opening.actions, ...comboActions(entry.combo)];
    const state = replay(entry.opening, entry.combo);
    const stateKey = `${entry.opening}|${entry.combo.join(',')}`;
    let byKey = evaluated.get(stateKey);
    if (!byKey) {
      byKey = new Map();
      for (const f of evaluateFindingsWithPaths(plan, state)) {
        const k = findingKey(f);
        if (!byKey.has(k)) byKey.set(k, f);
      }
      evaluated.set(stateKey, byKey);
    }
    const full = byKey.get(key);
    kept.push({
      swept: { finding: full ?? entry.finding, state, stateSize: entry.size, actions, event: opening.event },
      key,
    });
  }
  // By size, then by finding key (each kept finding's key is the one it was kept under).
  const findings = kept
    .sort((a, b) => a.swept.stateSize - b.swept.stateSize || a.key.localeCompare(b.key))
    .map((k) => k.swept);
  const complete = !stopped && visited === planTotal && !planned.incompleteReason;
  const result: SweepResult = {
    strategy: planned.strategy,
    statesVisited: visited,
    statesPlanned: planTotal,
    complete,
    findings,
  };
  if (!complete)
    result.incompleteReason =
      planned.incompleteReason ??
      (stopped
        ? `Stopped after ${visited} of ${planTotal} states.`
        : `Visited ${visited} of ${planTotal} states.`);
  if (planned.reduction) result.reduction = planned.reduction;
  if (planned.cleanProof && complete) result.cleanProof = planned.cleanProof;
  return result;
}
