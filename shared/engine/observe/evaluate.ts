/** Observations and findings for one plan in one state: (plan, state) → nets → observations → findings. */
import { pairColour } from '../document/cable-code';
import type { Plan } from '../document/plan.schema';
import { listWords } from '../document/words';
import { getNetlist, type Netlist, type SetInfo } from '../model/netlist';
import { createMech, fillMech, type Mech } from '../model/nets';
import type { FarPhase, LineState, SimState } from '../sim/state.schema';
import type {
  Cadence,
  Evaluation,
  Finding,
  LineObservation,
  LineStatus,
  SetObservation,
  StationObservation,
  ToneName,
} from './evaluation.types';
import { computeFacts, isActive, selectedLines, type NetFacts } from '../model/facts';
import {
  crossingSentence,
  PathFinder,
  firstCrossing,
  firstUnitLeadSentence,
  unitsAlong,
  type TerminalPath,
} from './paths';
import { strongestCadence } from './signals';
import { staticFindings } from './static-findings';
import { withWiringSymptoms } from './rules/wiring-symptoms';

export interface EvaluateOptions {
  /** Trace conductor paths and write path-based sentences (default true). Sweeps turn it off for speed. */
  paths?: boolean;
}

const TONE_OF_PHASE: Partial<Record<FarPhase, ToneName>> = {
  'dial-tone': 'dial',
  ringback: 'ringback',
  busy: 'busy',
  reorder: 'reorder',
  talking: 'voice',
  answered: 'voice',
};

const TALKING: ReadonlySet<FarPhase> = new Set(['talking', 'answered']);

interface Context {
  nl: Netlist;
  state: SimState;
  mech: Mech;
  facts: NetFacts;
  lineStates: (LineState | undefined)[];
  paths: boolean;
  /** describeVia's sentences of this evaluation's paths (findings share paths). */
  via?: Map<TerminalPath, string>;
}

function lineStatus(c: Context, i: number): LineStatus {
  const ls = c.lineStates[i];
  if (c.facts.aClosed[i]) return 'in-use';
  if (ls?.circuit === 'held') return 'held';
  if (ls?.ringing) return 'ringing';
  return 'idle';
}

function lineCadence(status: LineStatus): Cadence {
  return status === 'in-use'
    ? 'steady'
    : status === 'held'
      ? 'wink'
      : status === 'ringing'
        ? 'flash'
        : 'dark';
}

/** The nets of one mechanical state (sets' hookswitch, keys, hands-free switch): reusable across line states. */
export interface StateNets {
  readonly mech: Mech;
  readonly facts: NetFacts;
}

export function computeNets(plan: Plan, state: SimState): StateNets {
  const nl = getNetlist(plan);
  const mech = fillMech(nl, state, createMech(nl));
  const facts = computeFacts(nl, mech);
  return { mech, facts: { ...facts, roots: facts.roots.slice() } };
}

/** A mechanical state buffer for computeNetsInto. */
export function createMechFor(plan: Plan): Mech {
  return createMech(getNetlist(plan));
}

/**
 * computeNets into a caller's buffer (from createMechFor), for loops that drop one state's nets before computing
 * the next (the sweep): the result's mech is that buffer, overwritten by the next call.
 */
export function computeNetsInto(plan: Plan, state: SimState, mech: Mech): StateNets {
  const nl = getNetlist(plan);
  fillMech(nl, state, mech);
  const facts = computeFacts(nl, mech);
  return { mech, facts: { ...facts, roots: facts.roots.slice() } };
}

export function evaluate(plan: Plan, state: SimState, options: EvaluateOptions = {}): Evaluation {
  return evaluateWithNets(plan, state, computeNets(plan, state), options);
}

/** Same as evaluate, with nets from computeNets for a state with the same set states. */
export function evaluateWithNets(
  plan: Plan,
  state: SimState,
  nets: StateNets,
  options: EvaluateOptions = {},
): Evaluation {
  const nl = getNetlist(plan);
  const { mech, facts } = nets;
  const layout = layoutOf(nl);
  const nLines = nl.lines.length;
  const lineStates = lineStatesOf(nl, state);
  const c: Context = { nl, state, mech, facts, lineStates, paths: options.paths !== false };

  const statuses: LineStatus[] = new Array(nLines);
  const cadences: Cadence[] = new Array(nLines);
  const lines: LineObservation[] = new Array(nLines);
  for (let i = 0; i < nLines; i++) {
    statuses[i] = lineStatus(c, i);
    cadences[i] = lineCadence(statuses[i]);
    // Lines joined: same tip net or same ring net.
    const joinedWith = joinedLines(nl, facts, i);
    const setsOn: string[] = [];
    for (const s of facts.setsOn[i]) setsOn.push(nl.sets[s].id);
    lines[i] = {
      line: nl.lines[i].number,
      status: statuses[i],
      aClosed: facts.aClosed[i],
      loopClosed: facts.networkLoop[i] || statuses[i] === 'held',
      setsOn,
      lamp: cadences[i],
      far: lineStates[i]?.far.phase ?? 'idle',
      joinedWith,
    };
  }

  const roots = facts.roots;
  const d = nl.dense;
  const calling = state.intercom.calling;
  const driven = calling ? nl.stations.find((s) => s.id === calling) : undefined;
  const drivenT = driven ? roots[d[driven.t]] : -1;
  const drivenR = driven ? roots[d[driven.r]] : -1;
  const nSets = nl.sets.length;
  const ringerOn: boolean[] = new Array(nSets).fill(false);
  const buzzerOn: boolean[] = new Array(nSets).fill(false);
  const lampCadence: Cadence[] = new Array(nl.elements.length);
  const lampLines: number[][] = new Array(nl.elements.length);
  for (let k = 0; k < nl.elements.length; k++) {
    const e = nl.elements[k];
    if (e.owner < 0) continue;
    const ra = roots[d[e.a]];
    const rb = roots[d[e.b]];
    if (ra === rb) continue; // a shorted load never sounds or lights
    if (e.kind === 'buzzer') {
      if (driven && ((ra === drivenT && rb === drivenR) || (ra === drivenR && rb === drivenT)))
        buzzerOn[e.owner] = true;
    } else if (e.kind === 'ringer') {
      for (let i = 0; i < nLines; i++) {
        const x = facts.rootT[i];
        const y = facts.rootR[i];
        if (lineStates[i]?.ringing && ((ra === x && rb === y) || (ra === y && rb === x)))
          ringerOn[e.owner] = true;
      }
    } else if (e.kind === 'lamp') {
      let lamp: Cadence = 'dark';
      const lit: number[] = [];
      const g = facts.gnd;
      for (let i = 0; i < nLines; i++) {
        const x = facts.rootL[i];
        if ((ra === x && rb === g) || (ra === g && rb === x)) {
          lit.push(nl.lines[i].number);
          lamp = strongestCadence(lamp, cadences[i]);
        }
      }
      lampCadence[k] = lamp;
      lampLines[k] = lit;
    }
  }

  const sets: SetObservation[] = new Array(nSets);
  for (let si = 0; si < nSets; si++) {
    const s = nl.sets[si];
    const hears: number[] = [];
    const tones: { tone: ToneName; line: number }[] = [];
    for (const i of facts.hears[si]) {
      const number = nl.lines[i].number;
      hears.push(number);
      const tone = TONE_OF_PHASE[lineStates[i]?.far.phase ?? 'idle'];
      if (tone) tones.push({ tone, line: number });
    }
    const keySpecs = s.template?.keys ?? [];
    const keys: SetObservation['keys'] = new Array(keySpecs.length);
    for (let k = 0; k < keySpecs.length; k++) {
      const spec = keySpecs[k];
      const el = layout.lampOf[si][spec.index] ?? -1;
      keys[k] = {
        index: spec.index,
        label: spec.label,
        lamp: el >= 0 ? (lampCadence[el] ?? 'dark') : 'dark',
        lines: el >= 0 ? (lampLines[el] ?? []) : [],
      };
    }
    sets[si] = {
      set: s.id,
      offHook: mech.offHook[si] === 1,
      pressedKey: mech.pressedKey[si] || null,
      handsFreeOn: mech.handsFreeOn[si] === 1,
      keys,
      hears,
      tones,
      buzzer: buzzerOn[si],
      ringer: ringerOn[si],
    };
  }

  const stations: StationObservation[] = nl.stations.map((st, i) => {
    const buzzing: string[] = [];
    if (st.id === calling) for (let si = 0; si < nSets; si++) if (buzzerOn[si]) buzzing.push(nl.sets[si].id);
    return {
      station: st.id,
      code: st.code,
      calling: st.id === calling,
      buzzing,
      assigned: layout.assigned[i].slice(),
    };
  });

  const dynamic = dynamicFindings(c, lines, buzzerOn);
  const fixed = staticFindings(nl, c.paths);
  const findings = fixed.length ? dynamic.concat(fixed) : dynamic;
  return withWiringSymptoms(nl, facts, { lines, sets, stations, findings }); // cable wiring faults
}

interface Layout {
  /** Per set: element index of the lamp of each key index. */
  lampOf: number[][];
  /** Per station: ids of the sets assigned to it. */
  assigned: string[][];
  /** Per set: element indices of the speech networks it hears through, in element order. */
  networksOf: number[][];
}

const layouts = new WeakMap<Netlist, Layout>();

function layoutOf(nl: Netlist): Layout {
  let layout = layouts.get(nl);
  if (!layout) {
    const lampOf: number[][] = nl.sets.map(() => []);
    nl.elements.forEach((e, k) => {
      if (e.kind === 'lamp' && e.owner >= 0 && e.key !== undefined) lampOf[e.owner][e.key] = k;
    });
    const assigned = nl.stations.map((st) => nl.sets.filter((s) => s.station === st.id).map((s) => s.id));
    const networksOf: number[][] = nl.sets.map(() => []);
    nl.elements.forEach((e, k) => {
      if (e.kind === 'network' && e.owner >= 0) networksOf[e.owner].push(k);
    });
    layout = { lampOf, assigned, networksOf };
    layouts.set(nl, layout);
  }
  return layout;
}

type LineFacts = Pick<LineObservation, 'line' | 'status' | 'aClosed' | 'far' | 'joinedWith'>;

function lineStatesOf(nl: Netlist, state: SimState): (LineState | undefined)[] {
  const out: (LineState | undefined)[] = new Array(nl.lines.length);
  for (let i = 0; i < nl.lines.length; i++) {
    const n = nl.lines[i].number;
    out[i] = undefined;
    for (const ls of state.lines) {
      if (ls.line === n) {
        out[i] = ls;
        break;
      }
    }
  }
  return out;
}

function joinedLines(nl: Netlist, facts: NetFacts, i: number): number[] {
  const joinedWith: number[] = [];
  for (let j = 0; j < nl.lines.length; j++) {
    if (i !== j && (facts.rootT[i] === facts.rootT[j] || facts.rootR[i] === facts.rootR[j])) {
      joinedWith.push(nl.lines[j].number);
    }
  }
  return joinedWith;
}

function buzzersOn(nl: Netlist, state: SimState, facts: NetFacts): boolean[] {
  const on: boolean[] = new Array(nl.sets.length).fill(false);
  const calling = state.intercom.calling;
  const driven = calling ? nl.stations.find((st) => st.id === calling) : undefined;
  if (!driven) return on;
  const roots = facts.roots;
  const d = nl.dense;
  const t = roots[d[driven.t]];
  const r = roots[d[driven.r]];
  for (const e of nl.elements) {
    if (e.kind !== 'buzzer' || e.owner < 0) continue;
    const ra = roots[d[e.a]];
    const rb = roots[d[e.b]];
    if (ra !== rb && ((ra === t && rb === r) || (ra === r && rb === t))) on[e.owner] = true;
  }
  return on;
}

/** The per-line facts the findings need, without paths; joins only when asked (events never change them). */
function quickLineFacts(
  plan: Plan,
  state: SimState,
  nets: StateNets,
  withJoins: boolean,
): { c: Context; lines: LineFacts[] } {
  const nl = getNetlist(plan);
  const { mech, facts } = nets;
  const lineStates = lineStatesOf(nl, state);
  const c: Context = { nl, state, mech, facts, lineStates, paths: false };
  const lines: LineFacts[] = new Array(nl.lines.length);
  for (let i = 0; i < nl.lines.length; i++) {
    lines[i] = {
      line: nl.lines[i].number,
      status: lineStatus(c, i),
      aClosed: facts.aClosed[i],
      far: lineStates[i]?.far.phase ?? 'idle',
      joinedWith: withJoins ? joinedLines(nl, facts, i) : [],
    };
  }
  return { c, lines };
}

/**
 * Findings only, without paths or observations: the sweep's hot path. Same codes, sets, lines, stations and
 * messages (minus path-based wording) as evaluate(plan, state, { paths: false }).findings.
 */
export function evaluateFindings(plan: Plan, state: SimState, nets: StateNets): Finding[] {
  const { c, lines } = quickLineFacts(plan, state, nets, true);
  const { nl, facts } = c;
  const dynamic = dynamicFindings(c, lines, buzzersOn(nl, state, facts));
  const fixed = staticFindings(nl, false);
  return fixed.length ? dynamic.concat(fixed) : dynamic;
}

/**
 * The findings a KSU event adds to those of its mechanical state, for the sweep: it evaluates each mechanical
 * state once with the KSU idle (evaluateFindings over initialState's lines) and every other event with this. The
 * keys (code, sets, lines, stations) of evaluateFindings(plan, state, nets) are exactly those of that idle
 * evaluation and of these: no event changes which leads are joined, so only a line held aside (its lamp lit by the
 * hold bridge, not by its A-lead) and an intercom call sounding the wrong sets can add one. The findings returned
 * are the ones evaluateFindings returns for them.
 */
export function eventFindings(plan: Plan, state: SimState, nets: StateNets): Finding[] {
  if (!eventMayAddFindings(state)) return [];
  const calling = state.intercom.calling;
  const { c, lines } = quickLineFacts(plan, state, nets, false);
  return dynamicFindings(c, lines, calling ? buzzersOn(c.nl, state, c.facts) : [], true);
}

/** False when eventFindings is empty whatever the sets do: no line held aside and no intercom call. */
export function eventMayAddFindings(state: Pick<SimState, 'lines' | 'intercom'>): boolean {
  if (state.intercom.calling) return true;
  for (const ls of state.lines) if (ls.circuit === 'held' && ls.heldWithoutSelection) return true;
  return false;
}

/** eventsOnly: the findings a KSU event can add (see eventFindings); the others are left out. */
function dynamicFindings(c: Context, lines: LineFacts[], buzzerOn: boolean[], eventsOnly = false): Finding[] {
  const { nl, mech, facts } = c;
  const out: Finding[] = [];
  const finder = c.paths ? new PathFinder(nl, mech, facts.roots) : null;
  const nSets = nl.sets.length;
  const selected: number[][] = new Array(nSets);
  const active: boolean[] = new Array(nSets);
  for (let si = 0; si < nSets; si++) {
    selected[si] = selectedLines(nl, si, mech);
    active[si] = isActive(mech, si);
  }

  if (!eventsOnly) mechanicalFindings(c, lines, selected, active, out, finder);

  // LINE_LIT_UNATTENDED
  for (let i = 0; i < lines.length; i++) {
    const obs = lines[i];
    const ls = c.lineStates[i];
    const heldAside = obs.status === 'held' && !!ls?.heldWithoutSelection;
    if (!obs.aClosed && !heldAside) continue;
    let attended = false;
    for (let si = 0; si < nSets && !attended; si++) attended = active[si] && selected[si].includes(obs.line);
    const litByA = obs.aClosed && !attended;
    if (!litByA && !heldAside) continue;
    if (eventsOnly && litByA) continue;
    const latched = nl.sets.filter(
      (s) => mech.pressedKey[s.index] > 0 && selected[s.index].includes(obs.line),
    );
    const p = litByA ? pathIn(finder, nl.lines[i].a, nl.gnd) : null;
    const why = litByA
      ? `its A-lead is grounded though no set in use has selected it${p ? describeVia(c, p) : ''}`
      : 'it went on hold though the set that pressed hold had not selected it';
    out.push({
      code: 'LINE_LIT_UNATTENDED',
      severity: 'fault',
      sets: latched.map((s) => s.id),
      lines: [obs.line],
      stations: [],
      message: `Line ${obs.line} is lit with nobody on it: ${why}.`,
      path: p && finder ? finder.hopsOf(p) : [],
    });
  }

  // INTERCOM_SOUNDS_SEVERAL
  const calling = c.state.intercom.calling;
  const station = calling ? nl.stations.find((s) => s.id === calling) : undefined;
  if (station) {
    const sounding = nl.sets.filter((s) => buzzerOn[s.index]);
    const extra = sounding.filter((s) => s.station !== station.id);
    // A lone unassigned set answering the only call it can hear is not a fault.
    const misdirected =
      extra.length > 0 && (sounding.length > 1 || extra.some((s) => s.station !== undefined));
    if (misdirected) {
      const buzzer = nl.elements.find((e) => e.kind === 'buzzer' && e.owner === extra[0].index);
      const p = buzzer ? (pathIn(finder, station.t, buzzer.a) ?? pathIn(finder, station.t, buzzer.b)) : null;
      out.push({
        code: 'INTERCOM_SOUNDS_SEVERAL',
        severity: 'fault',
        sets: sounding.map((s) => s.id),
        lines: [],
        stations: [station.id],
        message: intercomMessage(c, station.code, sounding, extra, p),
        path: p && finder ? finder.hopsOf(p) : [],
      });
    }
  }
  finder?.release();
  return out;
}

/** Lines joined, sets hearing several or unselected lines, break-ins: what the sets' positions alone decide. */
function mechanicalFindings(
  c: Context,
  lines: LineFacts[],
  selected: number[][],
  active: boolean[],
  out: Finding[],
  finder: PathFinder | null,
): void {
  const { nl, mech, facts } = c;
  // LINES_JOINED: one finding per group of joined lines.
  const seen = new Set<number>();
  lines.forEach((obs, i) => {
    if (!obs.joinedWith.length || seen.has(obs.line)) return;
    const group = [obs.line, ...obs.joinedWith].sort((a, b) => a - b);
    group.forEach((n) => seen.add(n));
    const involved = nl.sets.filter(
      (s) => selected[s.index].some((n) => group.includes(n)) && mech.pressedKey[s.index] > 0,
    );
    const j = nl.lines.findIndex((l) => l.number === group.find((n) => n !== obs.line));
    const sameTip = facts.rootT[i] === facts.rootT[j];
    const p = pathIn(
      finder,
      sameTip ? nl.lines[i].t : nl.lines[i].r,
      sameTip ? nl.lines[j].t : nl.lines[j].r,
    );
    let how = involved.length ? ` through ${involved.map((s) => s.name).join(' and ')}` : '';
    if (p) {
      const crossing = firstCrossing(nl, p);
      how = crossing ? `: ${crossingSentence(crossing)}` : ` along ${unitsAlong(nl, p).join(', ')}`;
    }
    out.push({
      code: 'LINES_JOINED',
      severity: 'fault',
      sets: involved.map((s) => s.id),
      lines: group,
      stations: [],
      message: `Lines ${listWords(group)} are joined${how}.`,
      path: p && finder ? finder.hopsOf(p) : [],
    });
  });

  // Per line index: the sets on it through their own key, in set order (listeners other than them break in).
  const onCallByLine: (SetInfo[] | undefined)[] = new Array(nl.lines.length);
  for (const s of nl.sets) {
    const heard = facts.hears[s.index];
    if (!heard.length) continue;
    const heardNumbers = heard.map((i) => nl.lines[i].number);
    const networkTip = finder ? networkTerminal(c, s.index) : -1;
    if (heard.length > 1) {
      const stray = heard.find((i) => !selected[s.index].includes(nl.lines[i].number)) ?? heard[1];
      const p = networkTip >= 0 ? pathIn(finder, nl.lines[stray].t, networkTip) : null;
      out.push({
        code: 'SET_HEARS_SEVERAL_LINES',
        severity: 'fault',
        sets: [s.id],
        lines: heardNumbers,
        stations: [],
        message: `${s.name} hears lines ${listWords(heardNumbers)} at once${p ? describeVia(c, p) : ''}.`,
        path: p && finder ? finder.hopsOf(p) : [],
      });
    }
    for (const i of heard) {
      const line = nl.lines[i].number;
      if (selected[s.index].includes(line)) continue;
      const p = networkTip >= 0 ? pathIn(finder, nl.lines[i].t, networkTip) : null;
      const keyText =
        mech.pressedKey[s.index] > 0
          ? `with line key ${selected[s.index].join(', ')} down`
          : 'with no line key down';
      out.push({
        code: 'SET_HEARS_UNSELECTED_LINE',
        severity: 'fault',
        sets: [s.id],
        lines: [line],
        stations: [],
        message: `${s.name} hears line ${line} ${keyText}${p ? describeVia(c, p) : ''}.`,
        path: p && finder ? finder.hopsOf(p) : [],
      });
      // Another set is on that line through its own key: this set is listening in on its call.
      const far = lines[i].far;
      const onCall = (onCallByLine[i] ??= nl.sets.filter(
        (o) => active[o.index] && selected[o.index].includes(line) && facts.hears[o.index].includes(i),
      ));
      const others = onCall.includes(s) ? onCall.filter((o) => o !== s) : onCall;
      if (!others.length) continue;
      const parties = [...others.map((o) => o.name), ...(TALKING.has(far) ? ['the far party'] : [])];
      out.push({
        code: 'BREAK_IN',
        severity: 'fault',
        sets: [s.id, ...others.map((o) => o.id)],
        lines: [line],
        stations: [],
        message: `${s.name} breaks into the call on line ${line} and hears ${parties.join(' and ')}${p ? describeVia(c, p) : ''}.`,
        path: p && finder ? finder.hopsOf(p) : [],
      });
    }
  }
}

/** The conductor path between two terminals in this state, when paths are traced. */
function pathIn(finder: PathFinder | null, from: number, to: number): TerminalPath | null {
  return finder ? finder.path(from, to) : null;
}

/** A terminal of the set's (or its add-on's) speech network that is on a line, for path tracing. */
function networkTerminal(c: Context, setIndex: number): number {
  const { elements, dense } = c.nl;
  const { roots, rootT } = c.facts;
  for (const k of layoutOf(c.nl).networksOf[setIndex]) {
    const e = elements[k];
    const ra = roots[dense[e.a]];
    if (rootT.includes(ra)) return e.a;
    const rb = roots[dense[e.b]];
    if (rootT.includes(rb)) return e.b;
  }
  return -1;
}

/** ", because Front's talk pair (CT) on pair 23 … is bridged to …": once per path (findings share paths). */
function describeVia(c: Context, p: TerminalPath): string {
  const cache = (c.via ??= new Map());
  let text = cache.get(p);
  if (text === undefined) {
    const crossing = firstCrossing(c.nl, p);
    const lead = crossing ? null : firstUnitLeadSentence(c.nl, p);
    text = crossing ? `, because ${crossingSentence(crossing)}` : lead ? `, through ${lead}` : '';
    cache.set(p, text);
  }
  return text;
}

function stationCode(nl: Netlist, id: string): string {
  return nl.stations.find((st) => st.id === id)?.code ?? id;
}

function intercomMessage(
  c: Context,
  code: string,
  sounding: Netlist['sets'],
  extra: Netlist['sets'],
  p: TerminalPath | null,
): string {
  let text = `An intercom call to station ${code} buzzes ${sounding.map((s) => s.name).join(' and ')}`;
  const elsewhere = extra.filter((s) => s.station !== undefined);
  if (elsewhere.length) {
    text += `, though ${elsewhere.map((s) => `${s.name} answers station ${stationCode(c.nl, s.station!)}`).join(' and ')}`;
  }
  const pin = p ? p.terms.map((t) => c.nl.terminals[t]).find((t) => t.pair !== undefined) : undefined;
  if (pin?.pair) {
    const where = `pair ${pin.pair} (${pairColour(pin.pair).name})`;
    text += sounding.length > 1 ? `: their buzzers share ${where}` : ` on ${where}`;
  }
  return `${text}.`;
}
