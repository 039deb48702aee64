/** Observations of one state: per line (status, A-lead, loop, lamp, far end, joins), per set, per station. */
import type { NetFacts } from '../model/facts';
import { perNetlist, type Netlist } from '../model/netlist';
import type { Mech } from '../model/nets';
import type { FarPhase, LineState, SimState } from '../sim/state.schema';
import type {
  Cadence,
  LineObservation,
  LineStatus,
  SetObservation,
  StationObservation,
  ToneName,
} from './evaluation.types';
import type { LineFacts } from './rule.types';

const TONE_OF_PHASE: Partial<Record<FarPhase, ToneName>> = {
  'dial-tone': 'dial',
  ringback: 'ringback',
  busy: 'busy',
  reorder: 'reorder',
  talking: 'voice',
  answered: 'voice',
};

interface Layout {
  /** Per set: element index of the lamp of each key index. */
  lampOf: number[][];
  /** Per station: ids of the sets assigned to it. */
  assigned: string[][];
  /** Per set: element indices of the speech networks it hears through, in element order. */
  networksOf: number[][];
}

const layouts = new WeakMap<Netlist, Layout>();

/** Where each set's lamps and networks are among the elements, and who answers each station: once per netlist. */
export function layoutOf(nl: Netlist): Layout {
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

/** Per line index: the state's line, if the state names it. */
export function lineStatesOf(nl: Netlist, state: SimState): (LineState | undefined)[] {
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

export function lineStatus(
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
  i: number,
): LineStatus {
  const ls = lineStates[i];
  if (facts.aClosed[i]) return 'in-use';
  if (ls?.circuit === 'held') return 'held';
  if (ls?.ringing || ringingLineJoined(facts, lineStates, i) >= 0) return 'ringing';
  return 'idle';
}

/**
 * A ringing line whose talk pair is joined to line i's (both conductors, either way round), or -1: its ringing
 * current reaches line i's ringers and line circuit, which sees ringing and flashes the lamps (common practice).
 */
export function ringingLineJoined(
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
  i: number,
): number {
  const { rootT, rootR } = facts;
  const t = rootT[i];
  const r = rootR[i];
  if (t === r) return -1; // a shorted pair rings nothing
  for (let j = 0; j < rootT.length; j++) {
    if (j === i || !lineStates[j]?.ringing) continue;
    if ((rootT[j] === t && rootR[j] === r) || (rootT[j] === r && rootR[j] === t)) return j;
  }
  return -1;
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

/** Lines joined to line i: same tip net or same ring net. */
export function joinedLines(nl: Netlist, facts: NetFacts, i: number): number[] {
  const joinedWith: number[] = [];
  for (let j = 0; j < nl.lines.length; j++) {
    if (i !== j && (facts.rootT[i] === facts.rootT[j] || facts.rootR[i] === facts.rootR[j])) {
      joinedWith.push(nl.lines[j].number);
    }
  }
  return joinedWith;
}

/** The per-line facts the findings need, without observing sets; joins only when asked (events never change them). */
export function lineFacts(
  nl: Netlist,
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
  withJoins: boolean,
): LineFacts[] {
  const lines: LineFacts[] = new Array(nl.lines.length);
  for (let i = 0; i < nl.lines.length; i++) {
    lines[i] = {
      line: nl.lines[i].number,
      status: lineStatus(facts, lineStates, i),
      aClosed: facts.aClosed[i],
      far: lineStates[i]?.far.phase ?? 'idle',
      joinedWith: withJoins ? joinedLines(nl, facts, i) : [],
    };
  }
  return lines;
}

export function observeLines(
  nl: Netlist,
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
): LineObservation[] {
  const lines: LineObservation[] = new Array(nl.lines.length);
  for (let i = 0; i < nl.lines.length; i++) {
    const status = lineStatus(facts, lineStates, i);
    const setsOn: string[] = [];
    for (const s of facts.setsOn[i]) setsOn.push(nl.sets[s].id);
    lines[i] = {
      line: nl.lines[i].number,
      status,
      aClosed: facts.aClosed[i],
      loopClosed: facts.networkLoop[i] || status === 'held',
      setsOn,
      lamp: lineCadence(status),
      far: lineStates[i]?.far.phase ?? 'idle',
      joinedWith: joinedLines(nl, facts, i),
    };
  }
  return lines;
}

/** The station an intercom call drives, if any. */
function drivenStation(nl: Netlist, state: SimState) {
  const calling = state.intercom.calling;
  return calling ? nl.stations.find((st) => st.id === calling) : undefined;
}

/** Per set: its buzzer is across the called station's buzzer output (and not shorted). */
export function buzzersOn(nl: Netlist, state: SimState, facts: NetFacts): boolean[] {
  const on: boolean[] = new Array(nl.sets.length).fill(false);
  const driven = drivenStation(nl, state);
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

/** Lamp cadences by strength (strongestCadence): code 0 is dark, a larger code is more lit. */
const CADENCE_BY_CODE: readonly Cadence[] = ['dark', 'wink', 'flash', 'steady'];
const CODE_OF_CADENCE: Readonly<Record<Cadence, number>> = { dark: 0, wink: 1, flash: 2, steady: 3 };
/** lampCode for a load that is no lamp lit by anything (shorted, unowned): read as dark. */
const NO_LAMP = 0;

/**
 * What the loads do: ringers across a ringing line, lamps across a line's lamp lead and ground, buzzers. In
 * scratch arrays of the netlist (evaluation is synchronous), read before the next evaluation.
 */
interface Loads {
  ringerOn: Uint8Array;
  buzzerOn: boolean[];
  /** Per element index, for lamps: cadence code and the line indices (one bit each) whose lamp leads reach it. */
  lampCode: Uint8Array;
  lampLines: Int32Array;
}

interface LoadScratch extends Omit<Loads, 'buzzerOn'> {
  /** Per dense root: the first line (index) whose lamp lead is on it, or -1 (all -1 between calls). */
  firstLamp: Int32Array;
  /** Per line index: the next line on the same lamp-lead net, and the line's lamp cadence code. */
  nextLamp: Int32Array;
  lineCode: Uint8Array;
}

const loadScratch = new WeakMap<Netlist, LoadScratch>();

const LOAD_NONE = 0;
const LOAD_BUZZER = 1;
const LOAD_RINGER = 2;
const LOAD_LAMP = 3;

/** Per element: what kind of load the observations read it as (none: a network, or no owner), its ends' dense ids. */
const loadsOf = perNetlist((nl) => {
  const code = { buzzer: LOAD_BUZZER, ringer: LOAD_RINGER, lamp: LOAD_LAMP, network: LOAD_NONE };
  const n = nl.elements.length;
  const out = {
    kind: new Uint8Array(n),
    a: new Int32Array(n),
    b: new Int32Array(n),
    owner: new Int32Array(n),
  };
  // One plain pass (typed arrays' from() with a mapping function is several times slower on a new netlist).
  for (let i = 0; i < n; i++) {
    const e = nl.elements[i];
    out.kind[i] = e.owner < 0 ? LOAD_NONE : code[e.kind];
    out.a[i] = nl.dense[e.a];
    out.b[i] = nl.dense[e.b];
    out.owner[i] = e.owner;
  }
  return out;
});

function observeLoads(
  nl: Netlist,
  state: SimState,
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
  lines: readonly LineObservation[],
): Loads {
  const roots = facts.roots;
  const d = nl.dense;
  const nLines = nl.lines.length;
  const driven = drivenStation(nl, state);
  const drivenT = driven ? roots[d[driven.t]] : -1;
  const drivenR = driven ? roots[d[driven.r]] : -1;
  const nSets = nl.sets.length;
  let scratch = loadScratch.get(nl);
  if (!scratch) {
    scratch = {
      ringerOn: new Uint8Array(nSets),
      lampCode: new Uint8Array(nl.elements.length),
      lampLines: new Int32Array(nl.elements.length),
      firstLamp: new Int32Array(nl.denseCount).fill(-1),
      nextLamp: new Int32Array(nLines),
      lineCode: new Uint8Array(nLines),
    };
    loadScratch.set(nl, scratch);
  }
  const { ringerOn, lampCode, lampLines, firstLamp, nextLamp, lineCode } = scratch;
  ringerOn.fill(0);
  lampCode.fill(NO_LAMP);
  lampLines.fill(0);
  const buzzerOn: boolean[] = new Array(nSets).fill(false);
  const g = facts.gnd;
  const { rootT, rootR, rootL } = facts;
  let ringing = false;
  for (let i = 0; i < nLines && !ringing; i++) ringing = !!lineStates[i]?.ringing;
  // lines chained by lamp-lead net, so that a lamp finds the lines that light it in one look-up
  for (let i = 0; i < nLines; i++) {
    lineCode[i] = CODE_OF_CADENCE[lines[i].lamp];
    const l = rootL[i];
    if (l >= 0) {
      nextLamp[i] = firstLamp[l];
      firstLamp[l] = i;
    }
  }
  const { kind, a, b, owner } = loadsOf(nl);
  for (let k = 0; k < kind.length; k++) {
    const what = kind[k];
    if (what === LOAD_NONE) continue;
    const ra = roots[a[k]];
    const rb = roots[b[k]];
    if (ra === rb) continue; // a shorted load never sounds or lights
    if (what === LOAD_BUZZER) {
      if (driven && ((ra === drivenT && rb === drivenR) || (ra === drivenR && rb === drivenT)))
        buzzerOn[owner[k]] = true;
    } else if (what === LOAD_RINGER) {
      if (!ringing) continue;
      for (let i = 0; i < nLines; i++) {
        const x = rootT[i];
        const y = rootR[i];
        if (lineStates[i]?.ringing && ((ra === x && rb === y) || (ra === y && rb === x)))
          ringerOn[owner[k]] = 1;
      }
    } else {
      // lit by the lines whose lamp lead is on one end while ground is on the other
      const lead = ra === g ? rb : rb === g ? ra : -1;
      if (!(lead >= 0)) continue;
      let code = 0;
      let lit = 0;
      for (let i = firstLamp[lead]; i >= 0; i = nextLamp[i]) {
        lit |= 1 << i;
        if (lineCode[i] > code) code = lineCode[i];
      }
      lampCode[k] = code;
      lampLines[k] = lit;
    }
  }
  for (let i = 0; i < nLines; i++) if (rootL[i] >= 0) firstLamp[rootL[i]] = -1;
  return { ringerOn, buzzerOn, lampCode, lampLines };
}

/** The line numbers of the line indices set in `bits`, ascending. */
function lineNumbers(nl: Netlist, bits: number): number[] {
  const out: number[] = [];
  for (let i = 0; bits !== 0; i++, bits >>>= 1) if (bits & 1) out.push(nl.lines[i].number);
  return out;
}

function sameLineNumbers(nl: Netlist, xs: readonly number[], bits: number): boolean {
  let j = 0;
  for (let i = 0; bits !== 0; i++, bits >>>= 1) {
    if (!(bits & 1)) continue;
    if (xs[j++] !== nl.lines[i].number) return false;
  }
  return j === xs.length;
}

/** The last observation of each set of a netlist: kept when a set shows the same in the next evaluation. */
const lastSets = new WeakMap<Netlist, (SetObservation | undefined)[]>();
/**
 * What each of those observations' keys shows, as numbers: per key (in prev.keys order) its cadence code and the
 * bits of the line indices on its lamp, from which its lamp and lines were written.
 */
const lastLamps = new WeakMap<SetObservation, Int32Array>();

/** Does the set's last observation say what it says now? (Compared field by field, nothing allocated.) */
function stillSays(
  nl: Netlist,
  prev: SetObservation,
  si: number,
  mech: Mech,
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
  loads: Loads,
  lampOf: readonly number[],
): boolean {
  if (
    prev.offHook !== (mech.offHook[si] === 1) ||
    prev.pressedKey !== (mech.pressedKey[si] || null) ||
    prev.handsFreeOn !== (mech.handsFreeOn[si] === 1) ||
    prev.buzzer !== loads.buzzerOn[si] ||
    prev.ringer !== (loads.ringerOn[si] === 1)
  )
    return false;
  const heard = facts.hears[si];
  if (prev.hears.length !== heard.length) return false;
  let t = 0;
  for (let j = 0; j < heard.length; j++) {
    const number = nl.lines[heard[j]].number;
    if (prev.hears[j] !== number) return false;
    const tone = TONE_OF_PHASE[lineStates[heard[j]]?.far.phase ?? 'idle'];
    if (!tone) continue;
    const was = prev.tones[t++];
    if (!was || was.tone !== tone || was.line !== number) return false;
  }
  if (t !== prev.tones.length) return false;
  const lamps = lastLamps.get(prev);
  const keys = prev.keys;
  for (let k = 0; k < keys.length; k++) {
    const el = lampOf[keys[k].index] ?? -1;
    const code = el >= 0 ? loads.lampCode[el] : NO_LAMP;
    const lit = el >= 0 ? loads.lampLines[el] : 0;
    if (lamps) {
      if (lamps[2 * k] !== code || lamps[2 * k + 1] !== lit) return false;
      continue;
    }
    if (keys[k].lamp !== CADENCE_BY_CODE[code]) return false;
    if (!sameLineNumbers(nl, keys[k].lines, lit)) return false;
  }
  return true;
}

export function observeSets(
  nl: Netlist,
  state: SimState,
  mech: Mech,
  facts: NetFacts,
  lineStates: readonly (LineState | undefined)[],
  lines: readonly LineObservation[],
): { sets: SetObservation[]; buzzerOn: boolean[] } {
  const layout = layoutOf(nl);
  const loads = observeLoads(nl, state, facts, lineStates, lines);
  const { ringerOn, buzzerOn, lampCode, lampLines } = loads;
  let last = lastSets.get(nl);
  if (!last) lastSets.set(nl, (last = new Array(nl.sets.length)));
  const sets: SetObservation[] = new Array(nl.sets.length);
  for (let si = 0; si < nl.sets.length; si++) {
    const prev = last[si];
    if (prev && stillSays(nl, prev, si, mech, facts, lineStates, loads, layout.lampOf[si])) {
      sets[si] = prev;
      continue;
    }
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
    const lamps = new Int32Array(2 * keySpecs.length);
    for (let k = 0; k < keySpecs.length; k++) {
      const spec = keySpecs[k];
      const el = layout.lampOf[si][spec.index] ?? -1;
      const code = el >= 0 ? lampCode[el] : NO_LAMP;
      const lit = el >= 0 ? lampLines[el] : 0;
      lamps[2 * k] = code;
      lamps[2 * k + 1] = lit;
      keys[k] = {
        index: spec.index,
        label: spec.label,
        lamp: CADENCE_BY_CODE[code],
        lines: lineNumbers(nl, lit),
      };
    }
    const obs: SetObservation = {
      set: s.id,
      offHook: mech.offHook[si] === 1,
      pressedKey: mech.pressedKey[si] || null,
      handsFreeOn: mech.handsFreeOn[si] === 1,
      keys,
      hears,
      tones,
      buzzer: buzzerOn[si],
      ringer: ringerOn[si] === 1,
    };
    lastLamps.set(obs, lamps);
    sets[si] = last[si] = obs;
  }
  return { sets, buzzerOn };
}

export function observeStations(
  nl: Netlist,
  state: SimState,
  buzzerOn: readonly boolean[],
): StationObservation[] {
  const layout = layoutOf(nl);
  const calling = state.intercom.calling;
  return nl.stations.map((st, i) => {
    const buzzing: string[] = [];
    if (st.id === calling)
      for (let si = 0; si < nl.sets.length; si++) if (buzzerOn[si]) buzzing.push(nl.sets[si].id);
    return {
      station: st.id,
      code: st.code,
      calling: st.id === calling,
      buzzing,
      assigned: layout.assigned[i].slice(),
    };
  });
}
