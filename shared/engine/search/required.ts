/**
 * Checks that what plan.required asks for still works, by operating the plan through the engine's own actions.
 * Each failure says whether something is missing (a connection the function needs is absent) or extra (something
 * besides the wanted set or line is reached): lifting leads can only cure 'extra' failures, never 'missing' ones.
 */
import {
  applyActions,
  computeNetsInto,
  createMechFor,
  findSet,
  getNetlist,
  getTemplate,
  initialState,
  lineStatesOf,
  observeLines,
  observeSets,
  observeStations,
  type Evaluation,
  type Plan,
  type SimAction,
  type SimState,
} from './engine-port';

export interface RequiredFailure {
  function: 'allLinesOnEverySet' | 'intercomPerStation' | 'handsFreeSets';
  kind: 'missing' | 'extra';
  sets: string[];
  lines: number[];
  stations: string[];
  message: string;
}

/** Observes states of one plan: its netlist, initial state and one nets buffer, set up once for every check. */
interface Observer {
  plan: Plan;
  /**
   * What the lines do in a state and, as asked, the sets and the stations: the observations of
   * evaluate(plan, state), without its findings and wiring symptoms (no check reads them; symptoms only add notes
   * and noise). Sets and stations are left empty when not asked for.
   */
  observe(
    state: SimState,
    upTo: 'lines' | 'sets' | 'stations',
  ): Pick<Evaluation, 'lines' | 'sets' | 'stations'>;
  /** The actions applied to a state, the plan's initial state by default. */
  run(actions: SimAction[], from?: SimState): SimState;
}

function observerOf(plan: Plan): Observer {
  const nl = getNetlist(plan);
  const start = initialState(plan);
  // Each state's nets are read before the next state's are computed, so one buffer serves them all.
  const mech = createMechFor(plan);
  return {
    plan,
    observe(state, upTo) {
      const { facts } = computeNetsInto(plan, state, mech);
      const lineStates = lineStatesOf(nl, state);
      const lines = observeLines(nl, facts, lineStates);
      if (upTo === 'lines') return { lines, sets: [], stations: [] };
      const { sets, buzzerOn } = observeSets(nl, state, mech, facts, lineStates, lines);
      return { lines, sets, stations: upTo === 'stations' ? observeStations(nl, state, buzzerOn) : [] };
    },
    run: (actions, from = start) => applyActions(plan, from, actions),
  };
}

/** Lines the set can take: a line key (or a fixed line) for a line the KSU has. */
export function linesOfSet(plan: Plan, setId: string): { line: number; key: number | null }[] {
  const set = findSet(plan, setId);
  const tpl = set ? getTemplate(set.template) : undefined;
  if (!tpl) return [];
  const onKsu = new Set(plan.ksu.lines.map((l) => l.number));
  const keyed = (tpl.keys ?? [])
    .filter((k) => k.kind === 'line' && k.line !== undefined && onKsu.has(k.line))
    .map((k) => ({ line: k.line as number, key: k.index }));
  const fixed = (tpl.fixedLines ?? []).filter((l) => onKsu.has(l)).map((line) => ({ line, key: null }));
  return [...keyed, ...fixed];
}

function checkLines({ plan, observe, run }: Observer, out: RequiredFailure[]): void {
  for (const set of plan.sets) {
    const hasHold = (getTemplate(set.template)?.keys ?? []).some((k) => k.kind === 'hold');
    for (const { line, key } of linesOfSet(plan, set.id)) {
      const fail = (kind: RequiredFailure['kind'], what: string) =>
        out.push({
          function: 'allLinesOnEverySet',
          kind,
          sets: [set.id],
          lines: [line],
          stations: [],
          message: `${set.name} ${what} line ${line}`,
        });
      const select: SimAction[] = key === null ? [] : [{ kind: 'press-key', set: set.id, key }];
      let state = run([...select, { kind: 'lift-handset', set: set.id }]);
      let ev = observe(state, 'sets');
      const obs = ev.lines.find((l) => l.line === line);
      const hears = ev.sets.find((s) => s.set === set.id)?.hears ?? [];
      if (!obs?.aClosed || !obs.loopClosed || !hears.includes(line)) {
        fail('missing', 'cannot seize');
        continue;
      }
      if (hears.length > 1) fail('extra', 'does not hear alone on');
      if (hasHold && key !== null) {
        state = run([{ kind: 'press-hold', set: set.id }], state);
        ev = observe(state, 'lines');
        if (ev.lines.find((l) => l.line === line)?.status !== 'held') {
          fail('missing', 'cannot hold');
          continue;
        }
        state = run([{ kind: 'press-key', set: set.id, key }], state);
        ev = observe(state, 'sets');
        if (!(ev.sets.find((s) => s.set === set.id)?.hears ?? []).includes(line)) {
          fail('missing', 'cannot take back from hold');
          continue;
        }
      }
      state = run(
        [
          { kind: 'hang-up', set: set.id },
          { kind: 'release-keys', set: set.id },
        ],
        state,
      );
      ev = observe(state, 'lines');
      const after = ev.lines.find((l) => l.line === line);
      if (after && (after.aClosed || after.status !== 'idle')) fail('extra', 'cannot release');
    }
  }
}

function checkIntercom({ plan, observe, run }: Observer, out: RequiredFailure[]): void {
  for (const station of plan.ksu.stations) {
    const ev = observe(run([{ kind: 'intercom-call', station: station.id }]), 'stations');
    const obs = ev.stations.find((s) => s.station === station.id);
    const assigned = plan.sets.filter((s) => s.station === station.id).map((s) => s.id);
    const buzzing = obs?.buzzing ?? [];
    const missing = assigned.filter((id) => !buzzing.includes(id));
    // A station nobody is assigned to has no "its set": whoever answers it is not a failure of this function.
    const extra = assigned.length === 0 ? [] : buzzing.filter((id) => !assigned.includes(id));
    if (missing.length > 0) {
      out.push({
        function: 'intercomPerStation',
        kind: 'missing',
        sets: missing,
        lines: [],
        stations: [station.id],
        message: `A call to station ${station.code} does not buzz ${missing.join(', ')}`,
      });
    }
    if (extra.length > 0) {
      out.push({
        function: 'intercomPerStation',
        kind: 'extra',
        sets: extra,
        lines: [],
        stations: [station.id],
        message: `A call to station ${station.code} also buzzes ${extra.join(', ')}`,
      });
    }
  }
}

function checkHandsFree({ plan, observe, run }: Observer, out: RequiredFailure[]): void {
  for (const setId of plan.required.handsFreeSets) {
    const set = findSet(plan, setId);
    const name = set?.name ?? setId;
    const first = linesOfSet(plan, setId).find((l) => l.key !== null);
    const hasAddOn = plan.addOns.some((a) => a.serves === setId);
    const fail = (lines: number[]) =>
      out.push({
        function: 'handsFreeSets',
        kind: 'missing',
        sets: [setId],
        lines,
        stations: [],
        message: `${name}'s hands-free add-on does not take a line`,
      });
    if (!first || !hasAddOn) {
      fail([]);
      continue;
    }
    const state = run([
      { kind: 'press-key', set: setId, key: first.key as number },
      { kind: 'hands-free', set: setId, on: true },
    ]);
    const obs = observe(state, 'lines').lines.find((l) => l.line === first.line);
    if (!obs?.aClosed || !obs.loopClosed || !obs.setsOn.includes(setId)) fail([first.line]);
  }
}

/** Every way plan.required is not met, empty when all is well. */
export function checkRequired(plan: Plan): RequiredFailure[] {
  const out: RequiredFailure[] = [];
  const observer = observerOf(plan);
  if (plan.required.allLinesOnEverySet) checkLines(observer, out);
  if (plan.required.intercomPerStation) checkIntercom(observer, out);
  checkHandsFree(observer, out);
  return out;
}
