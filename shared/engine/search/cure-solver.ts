/**
 * The cure as an integer program (HiGHS): one 0/1 variable per candidate change, fewest changes first and then the
 * lowest cost, constraints added lazily from what the sweep of the changed plan still shows. Method: ./README.md
 * ("Cure as an integer program").
 */
import type { LegacyHighs } from 'highs';
import { publicChange, withChanges, type CureChange, type CureResult } from './cure';
import { candidatesFor, liftsOf, type Candidate, type Problem } from './cure-candidates';
import { seedWiringCovers } from './cure-seeds';
import { stationPortOfSets, sweep, type SweepResult } from './sweep';
import { checkRequired, type RequiredFailure } from './required';
import type { Finding, Plan } from './engine-port';

export interface OptimalCureOptions {
  /** Sets whose hands-free add-on must keep working (added to plan.required.handsFreeSets for this cure). */
  keepAddOn?: string[];
  /** Sets that may not be touched: no change in them or in the add-ons serving them. */
  untouched?: string[];
  /** Loads the solver; the default imports the `highs` package. A Web Worker may pass a loader with locateFile. */
  loadSolver?: () => Promise<LegacyHighs>;
  /** Largest number of solve-and-sweep rounds (default 40). */
  maxRounds?: number;
  shouldStop?: () => boolean;
}

/** What one of the options costs: the cure with it against the cure without it. */
export interface CureChoiceCost {
  set: string;
  option: 'keep-add-on' | 'untouched';
  /** Changes and cost weight of the cure with every option except this one (null: no cure without it either). */
  without: { changes: number; weight: number } | null;
  /** Extra changes and weight this option costs (null when either cure does not exist). */
  extraChanges: number | null;
  extraWeight: number | null;
}

export interface OptimalCureResult extends CureResult {
  /** Solve-and-sweep rounds until the changed plan swept clean. */
  rounds: number;
  /** Total weight of the changes (each change 1000 plus its cost rank). */
  weight: number;
  /** Whether the final sweep of the cured plan was complete (false: a partial sweep, see its incompleteReason). */
  verifiedBy: 'complete-sweep' | 'partial-sweep' | 'none';
  /** The finding that no allowed change can clear, when there is no cure. */
  blocking?: { finding?: Finding; failure?: RequiredFailure; reason: string };
  choices: CureChoiceCost[];
}

/** Each change counts this much, so fewer changes always win; the cost rank breaks ties. */
const CHANGE_WEIGHT = 1000;

/**
 * The solver stops only at the proven optimum: its default relative gap (1e-4) lets a solution about one unit of
 * weight above the best bound pass as optimal at ten changes, more than the cost ranks that break ties between
 * cures of as many changes (multiples of 1/1000).
 */
const EXACT: Parameters<LegacyHighs['solve']>[1] = { mip_rel_gap: 0 };

type Constraint =
  /**
   * At least one of these, or not every one of `unless`: a problem seen on a changed plan may rest on changes of
   * that round (a connection a buzzer move made), so its cover binds only the cures that make those changes again.
   */
  | { kind: 'cover'; ids: string[]; unless: string[] }
  /** Not exactly this combination (a no-good cut): sum(in) - sum(out) <= |in| - 1. */
  | { kind: 'not-exactly'; ids: string[] }
  /** Total weight at most this. */
  | { kind: 'weight-at-most'; max: number };

let solverPromise: Promise<LegacyHighs> | null = null;
function defaultSolver(): Promise<LegacyHighs> {
  solverPromise ??= import('highs').then((m) => m.default());
  return solverPromise;
}

/** The sweep of the cure's plan with these changes made (`plan`), shared by the cures of one cureOptimal call. */
type SweepOf = (plan: Plan, changes: readonly CureChange[]) => SweepResult;

interface Problemset {
  candidates: Map<string, Candidate>;
  constraints: Constraint[];
  /** Keys of constraints added, so a problem adds its constraint once. */
  seen: Set<string>;
}

function lpText(
  ps: Problemset,
  allowed: (c: Candidate) => boolean,
): { text: string; names: Map<string, string> } {
  const names = new Map<string, string>();
  const vars: string[] = [];
  for (const [id, c] of ps.candidates) {
    if (!allowed(c)) continue;
    const name = `x${names.size}`;
    names.set(id, name);
    vars.push(name);
  }
  const weight = (id: string) => CHANGE_WEIGHT + ps.candidates.get(id)!.rank;
  const ids = [...names.keys()];
  const objective = vars.map((v, i) => `${weight(ids[i])} ${v}`).join(' + ') || '0 x_empty';
  const lines: string[] = ['Minimize', ` obj: ${objective}`];
  lines.push('Subject To');
  let row = 0;
  const term = (ids: string[]) => ids.filter((id) => names.has(id)).map((id) => names.get(id)!);
  for (const con of ps.constraints) {
    if (con.kind === 'cover') {
      // sum(cover) + sum(1 - move) >= 1, that is sum(cover) - sum(move) >= 1 - |moves|
      const t = term(con.ids);
      const moves = term(con.unless);
      const expr = [t.join(' + '), ...moves.map((m) => `- ${m}`)].filter(Boolean).join(' ');
      lines.push(` r${row++}: ${expr || '0 x_empty'} >= ${1 - moves.length}`);
    } else if (con.kind === 'weight-at-most') {
      lines.push(` r${row++}: ${objective} <= ${con.max}`);
    } else {
      const inside = new Set(term(con.ids));
      const outside = vars.filter((v) => !inside.has(v));
      const expr = [...inside].join(' + ') + outside.map((v) => ` - ${v}`).join('');
      lines.push(` r${row++}: ${expr || '0 x_empty'} <= ${inside.size - 1}`);
    }
  }
  // Two changes on one pair of one part never combine; two buzzer moves never take one pair of one port.
  const groups = new Map<string, string[]>();
  for (const [id, c] of ps.candidates) {
    if (!names.has(id)) continue;
    const keys = [`${c.part}|${c.pair}`];
    if (c.crossConnect) keys.push(`cc|${c.crossConnect.port}|${c.crossConnect.pair}`);
    for (const k of keys) groups.set(k, [...(groups.get(k) ?? []), names.get(id)!]);
  }
  for (const members of groups.values())
    if (members.length > 1) lines.push(` r${row++}: ${members.join(' + ')} <= 1`);
  lines.push('Binary', ` ${vars.join(' ')}${vars.length ? '' : 'x_empty'}`, 'End');
  return { text: lines.join('\n'), names };
}

/**
 * A finding's conductor path without the connector pins it passes through: only the part terminals entered or left
 * by a lead remain, since only changing such a lead can break the path (a pin passed through an add-on's bridge
 * stays connected whatever that add-on's own leads do).
 */
function leadHopsOnly(problem: Problem, ksuId: string): Problem {
  if (!('finding' in problem)) return problem;
  // The KSU's own pins stay: there the path runs over a cross-connect entry, which a buzzer move can take away.
  const path = problem.finding.path.filter((h) => h.pin === undefined || h.part === ksuId);
  return path.length === problem.finding.path.length || path.length === 0
    ? problem
    : { finding: { ...problem.finding, path } };
}

/**
 * Adds the constraint "some candidate of this problem is chosen" (unless the cure leaves out one of the buzzer
 * moves `unless`, made in the plan the problem was seen on) and returns the candidates; none when the problem has
 * none. For a problem seen on a changed plan, `base` is the plan before the round's changes: its candidates for the
 * same problem join the changed plan's, since a cure without the round's moves has spare pairs that those moves took
 * (a buzzer move to such a pair is a way out too).
 */
function coverOf(
  ps: Problemset,
  plan: Plan,
  problem: Problem,
  ports: number[],
  unless: string[] = [],
  base?: Plan,
): Candidate[] {
  const own = candidatesFor(plan, leadHopsOnly(problem, plan.ksu.id), ports);
  const extra = base ? candidatesFor(base, leadHopsOnly(problem, plan.ksu.id), ports) : [];
  const ids = new Set(own.map((c) => c.id));
  const cands = [...own, ...extra.filter((c) => !ids.has(c.id) && ids.add(c.id))];
  const key = `${cands
    .map((c) => c.id)
    .sort()
    .join(' ')}|${[...unless].sort().join(' ')}`;
  if (ps.seen.has(key)) return cands;
  ps.seen.add(key);
  for (const c of cands) if (!ps.candidates.has(c.id)) ps.candidates.set(c.id, c);
  ps.constraints.push({ kind: 'cover', ids: cands.map((c) => c.id), unless });
  return cands;
}

/**
 * The cure with seeded covers (cure-seeds.ts), kept only when the integer program has no other solution of its
 * weight: every cover is a necessary condition, so the cure the unseeded rounds find (a verified cure of the same,
 * smallest weight) satisfies every seeded constraint too, and being the only solution of that weight it is this
 * one. Otherwise null, and the unseeded rounds run: which of several equal cures the solver picks depends on the
 * constraints it was given, and the answer stays the one those rounds give. Only where every candidate is a lift:
 * a finding seen after a buzzer move may need the move (a move adds a connection), so covers taken from changed
 * plans, and the candidates offered there, then depend on which changed plans the rounds look at.
 */
async function seededLoop(
  plan: Plan,
  ps: Problemset,
  allowed: (c: Candidate) => boolean,
  opts: OptimalCureOptions,
  ports: number[],
  sweepOf: SweepOf,
): Promise<LoopResult | null> {
  if ([...ps.candidates.values()].some((c) => c.kind === 'move')) return null;
  const seeded: Problemset = {
    candidates: new Map(ps.candidates),
    constraints: [...ps.constraints],
    seen: new Set(ps.seen),
  };
  seedWiringCovers(plan, (seedPlan, finding) => coverOf(seeded, seedPlan, { finding }, ports));
  if (seeded.constraints.length === ps.constraints.length) return null;
  const loop = await solveLoop(plan, seeded, allowed, opts, sweepOf);
  if (!loop.ok || loop.chosen.some((c) => c.kind === 'move')) return null;
  // Any other cure of this weight, over every lift the plan has (the unseeded rounds may offer lifts these rounds
  // never saw). Weights are multiples of 1/1000 (cure-candidates.ts): half of that is no other weight.
  const check: Problemset = { ...seeded, candidates: new Map(seeded.candidates) };
  for (const c of liftsOf(
    plan,
    plan.sets.map((s) => s.id),
  ))
    if (!check.candidates.has(c.id)) check.candidates.set(c.id, c);
  check.constraints = [
    ...seeded.constraints,
    { kind: 'weight-at-most', max: loop.weight + 0.0005 },
    { kind: 'not-exactly', ids: loop.chosen.map((c) => c.id) },
  ];
  const highs = await (opts.loadSolver ?? defaultSolver)();
  return highs.solve(lpText(check, allowed).text, EXACT).Status === 'Infeasible' ? loop : null;
}

interface LoopResult {
  ok: boolean;
  chosen: Candidate[];
  weight: number;
  rounds: number;
  after: Finding[];
  failures: RequiredFailure[];
  verifiedBy: OptimalCureResult['verifiedBy'];
  blocking?: OptimalCureResult['blocking'];
  stopped: boolean;
}

/**
 * Solve, apply, sweep; every finding or failure the changed plan still shows adds its constraint; until the changed
 * plan sweeps clean and keeps the required functions, or the program has no solution.
 */
async function solveLoop(
  plan: Plan,
  ps: Problemset,
  allowed: (c: Candidate) => boolean,
  opts: OptimalCureOptions,
  sweepOf: SweepOf,
): Promise<LoopResult> {
  const highs = await (opts.loadSolver ?? defaultSolver)();
  const ports = stationPortOfSets(plan);
  const maxRounds = opts.maxRounds ?? 40;
  let after: Finding[] = [];
  // The required functions of the last changed plan, checked on first use (see below).
  let failuresOf = (): RequiredFailure[] => [];
  for (let round = 1; round <= maxRounds; round++) {
    if (opts.shouldStop?.()) break;
    const { text, names } = lpText(ps, allowed);
    const solution = highs.solve(text, EXACT);
    if (solution.Status !== 'Optimal') {
      // Infeasible: some constraint has no allowed candidate, or the candidates exclude each other.
      const empty = ps.constraints.findIndex(
        (c) => c.kind === 'cover' && !c.unless.length && !c.ids.some((id) => names.has(id)),
      );
      return {
        ok: false,
        chosen: [],
        weight: 0,
        rounds: round,
        after,
        failures: failuresOf(),
        verifiedBy: 'none',
        stopped: false,
        blocking: {
          reason:
            empty >= 0
              ? 'no allowed change touches its conductor path'
              : `the solver answered "${solution.Status}"`,
        },
      };
    }
    const chosen: Candidate[] = [];
    for (const [id, name] of names) {
      if ((solution.Columns[name]?.Primal ?? 0) > 0.5) chosen.push(ps.candidates.get(id)!);
    }
    chosen.sort((a, b) => a.id.localeCompare(b.id));
    const weight = chosen.reduce((s, c) => s + CHANGE_WEIGHT + c.rank, 0);
    const changes = chosen.map(publicChange);
    const cured = withChanges(plan, changes);
    const swept = sweepOf(cured, changes);
    after = swept.findings.map((f) => f.finding);
    // The required functions only decide a round whose sweep is clean (a round with findings fails either way and
    // adds no constraint from them); otherwise they are checked when the loop ends without a cure, for its report.
    let failures: RequiredFailure[] | null = null;
    failuresOf = () => (failures ??= checkRequired(cured));
    if (after.length === 0 && failuresOf().length === 0) {
      return {
        ok: true,
        chosen,
        weight,
        rounds: round,
        after,
        failures: [],
        verifiedBy: swept.complete ? 'complete-sweep' : 'partial-sweep',
        stopped: false,
      };
    }
    // A finding of the changed plan needs one of its covers only in cures that make the buzzer moves it may rest
    // on: a move adds a connection (the lead on its spare pair, the cross-connect entry that follows it), and every
    // hop over that connection names the spare pair. Lifts only take connections away. An intercom call sounding
    // several buzzers also rests on the other buzzers it sounds, which a move feeding that station may have added.
    // A finding with no path traced counts every move.
    const moves = chosen.filter((c) => c.kind === 'move');
    for (const f of swept.findings) {
      const { path, code, stations } = f.finding;
      const over = moves.filter(
        (m) =>
          !path.length ||
          path.some((h) => h.pair === movedTo(m)) ||
          (code === 'INTERCOM_SOUNDS_SEVERAL' &&
            m.crossConnect?.lead.kind === 'buzzer' &&
            stations.includes(m.crossConnect.lead.station)),
      );
      coverOf(
        ps,
        cured,
        { finding: f.finding },
        ports,
        over.map((m) => m.id),
        plan,
      );
    }
    // A station's call that misses a set assigned to it after these changes misses it after any further lifts and
    // moves of other sets too (none adds a connection to that set's buzzer pair): every cure that makes all of
    // this round's changes also moves that set's buzzer.
    if (after.length === 0)
      for (const failure of missedBuzzers(failuresOf()))
        coverOf(
          ps,
          cured,
          { failure },
          ports,
          chosen.map((c) => c.id),
          plan,
        );
    // Lifting only takes connections away: a change set that takes away a required function, or whose remaining
    // findings no candidate touches, is ruled out exactly (not its supersets).
    ps.constraints.push({ kind: 'not-exactly', ids: chosen.map((c) => c.id) });
  }
  return {
    ok: false,
    chosen: [],
    weight: 0,
    rounds: maxRounds,
    after,
    failures: failuresOf(),
    verifiedBy: 'none',
    stopped: true,
  };
}

/**
 * One failure per set a station's call misses though the set is assigned to it: each needs a move of its own buzzer
 * lead, the only change that adds a connection to it.
 */
function missedBuzzers(failures: readonly RequiredFailure[]): RequiredFailure[] {
  return failures
    .filter((f) => f.function === 'intercomPerStation' && f.kind === 'missing')
    .flatMap((f) => f.sets.map((set) => ({ ...f, sets: [set] })));
}

/** The spare pair a buzzer move puts its lead on. */
function movedTo(c: Candidate): number | undefined {
  return c.change.kind === 'move' ? c.change.toPair : undefined;
}

function partsOf(plan: Plan, setIds: readonly string[]): Set<string> {
  const out = new Set(setIds);
  for (const a of plan.addOns) if (setIds.includes(a.serves)) out.add(a.id);
  return out;
}

/**
 * The cure with the fewest lead changes (then the lowest cost) that clears every finding of the sweep and keeps the
 * required functions, proved minimal by the integer program (see README). Asynchronous: it loads the solver.
 */
export async function cureOptimal(input: Plan, opts: OptimalCureOptions = {}): Promise<OptimalCureResult> {
  // The sweep reads the plan's wiring, never plan.required (all that the options change): one sweep of the plan,
  // and of each changed plan, serves the cure and every choice.
  const swept = new Map<string, SweepResult>();
  const sweepOf: SweepOf = (plan, changes) => {
    const key = JSON.stringify(changes);
    let result = swept.get(key);
    if (!result) swept.set(key, (result = sweep(plan)));
    return result;
  };
  const result = await cureOnce(input, opts, sweepOf);
  const keep = opts.keepAddOn ?? [];
  const untouched = opts.untouched ?? [];
  // What each option costs: the same cure with that one option left out.
  const options = [
    ...keep.map((set) => ({ set, option: 'keep-add-on' as const })),
    ...untouched.map((set) => ({ set, option: 'untouched' as const })),
  ];
  for (const choice of options) {
    const without = await cureOnce(
      input,
      {
        ...opts,
        keepAddOn: keep.filter((s) => !(choice.option === 'keep-add-on' && s === choice.set)),
        untouched: untouched.filter((s) => !(choice.option === 'untouched' && s === choice.set)),
      },
      sweepOf,
    );
    const both = without.ok && result.ok;
    result.choices.push({
      ...choice,
      without: without.ok ? { changes: without.changes.length, weight: without.weight } : null,
      extraChanges: both ? result.changes.length - without.changes.length : null,
      extraWeight: both ? result.weight - without.weight : null,
    });
  }
  return result;
}

/** The cure of input with these options. */
async function cureOnce(input: Plan, opts: OptimalCureOptions, sweepOf: SweepOf): Promise<OptimalCureResult> {
  const keep = opts.keepAddOn ?? [];
  const untouched = opts.untouched ?? [];
  const plan: Plan = keep.length
    ? {
        ...input,
        required: {
          ...input.required,
          handsFreeSets: [...new Set([...input.required.handsFreeSets, ...keep])],
        },
      }
    : input;
  const ports = stationPortOfSets(plan);
  const first = sweepOf(input, []);
  const before = first.findings.map((f) => f.finding);
  // The plan's own required functions: they decide only whether a plan with no finding needs a cure, and are
  // reported when there is no cure.
  let baseChecked: RequiredFailure[] | null = null;
  const baseFailures = () => (baseChecked ??= checkRequired(plan));
  const ps: Problemset = { candidates: new Map(), constraints: [], seen: new Set() };
  const none = {
    changes: [],
    before,
    requiredFailures: [] as RequiredFailure[],
    proofOfMinimality: 'exhaustive' as const,
    choices: [] as CureChoiceCost[],
  };
  if (before.length === 0 && baseFailures().length === 0) {
    return {
      ...none,
      ok: true,
      after: [],
      searched: 1,
      rounds: 0,
      weight: 0,
      verifiedBy: first.complete ? 'complete-sweep' : 'partial-sweep',
      message: 'Nothing to cure: the sweep found no faults and every required function works.',
    };
  }
  // Round zero: one constraint per finding of the plan, and per required function that already fails.
  for (const f of first.findings) {
    if (!coverOf(ps, plan, { finding: f.finding }, ports).length) {
      return noCure(
        before,
        baseFailures(),
        { finding: f.finding, reason: 'no change the cure may make touches its conductor path' },
        first.complete,
      );
    }
  }
  // A station's call that does not reach a set assigned to it needs a new connection to that set's buzzer, and the
  // only change that adds one is a move of that set's buzzer lead with the station's cross-connect entry: one of
  // those moves is in every cure. (Other failures have no such bound: a lift elsewhere may restore them.)
  for (const failure of plan.required.intercomPerStation ? missedBuzzers(baseFailures()) : [])
    if (!coverOf(ps, plan, { failure }, ports).length)
      return noCure(
        before,
        baseFailures(),
        { failure, reason: 'no spare pair on its station port can take its buzzer lead' },
        first.complete,
      );
  const forbidden = partsOf(plan, untouched);
  const allowedWith = (blocked: Set<string>) => (c: Candidate) => !blocked.has(c.part);
  const allowed = allowedWith(forbidden);
  const loop =
    (await seededLoop(plan, ps, allowed, opts, ports, sweepOf)) ??
    (await solveLoop(plan, ps, allowed, opts, sweepOf));

  const choices: CureChoiceCost[] = [];
  if (!loop.ok) {
    const blockingFinding = loop.after[0];
    return {
      ...noCure(
        before,
        loop.failures.length ? loop.failures : baseFailures(),
        loop.blocking ?? {
          finding: blockingFinding,
          reason: loop.stopped
            ? 'the search stopped before the changed plan swept clean'
            : 'no allowed change clears it',
        },
        first.complete,
      ),
      after: loop.after.length ? loop.after : before,
      rounds: loop.rounds,
      choices,
    };
  }
  const n = loop.chosen.length;
  return {
    ok: true,
    changes: loop.chosen.map(publicChange),
    before,
    after: [],
    requiredFailures: [],
    proofOfMinimality: first.complete ? 'exhaustive' : 'heuristic',
    searched: loop.rounds,
    rounds: loop.rounds,
    weight: loop.weight,
    verifiedBy: loop.verifiedBy,
    choices,
    message:
      `${n} lead change${n === 1 ? '' : 's'} clear every finding and keep the required functions; ` +
      (first.complete
        ? 'no cure with fewer changes exists among the lifts and buzzer moves considered.'
        : 'none with fewer changes clears the findings the partial sweep of the plan reached.') +
      (loop.verifiedBy === 'partial-sweep' ? ' The changed plan was checked by a partial sweep only.' : ''),
  };
}

function noCure(
  before: Finding[],
  failures: RequiredFailure[],
  blocking: NonNullable<OptimalCureResult['blocking']>,
  complete: boolean,
): OptimalCureResult {
  const what = blocking.finding?.message ?? blocking.failure?.message ?? 'A finding';
  return {
    ok: false,
    changes: [],
    before,
    after: blocking.finding ? [blocking.finding] : before,
    requiredFailures: failures,
    proofOfMinimality: complete ? 'exhaustive' : 'heuristic',
    searched: 0,
    rounds: 0,
    weight: 0,
    verifiedBy: 'none',
    blocking,
    choices: [],
    message: `No cure: ${what.replace(/\.$/, '')} — ${blocking.reason}.`,
  };
}
