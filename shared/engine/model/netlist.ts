/**
 * The model layer: a plan turned into terminals, wires, loads (elements) and contacts.
 * Built once per plan object (cached in a WeakMap), from part wirings cached by content (an edit rewires only the
 * part it changed); lead changes and the KSU cross-connect are applied here.
 * Wires never change with the state, so their connectivity is solved once (static components); per state only the
 * closed contacts are unioned over those components (see nets.ts).
 */
import { pinOf, pinToPair, pairColour, PIN_COUNT } from '../document/cable-code';
import type { Conductor, LeadChange, Plan } from '../document/plan.schema';
import { getTemplate, ksuPortName } from '../templates/part-templates';
import type { ElementKind, LeadSpec, PartKind, PartTemplate } from '../templates/template.types';
import { effectiveCrossConnect } from './cross-connect';
import { applyLeadChanges } from './lead-changes';
import { cableWires } from './cable-faults';

export interface PartInfo {
  index: number;
  id: string;
  name: string;
  kind: PartKind;
  template: PartTemplate | undefined;
  /** Index into netlist.sets for sets, -1 otherwise. */
  setIndex: number;
  /** For an add-on: index of the set it serves (its switch follows that set's hands-free state), else -1. */
  servesSet: number;
}

export interface TerminalInfo {
  part: number;
  name: string;
  /** For connector pins. */
  port?: string;
  pin?: number;
  pair?: number;
  conductor?: Conductor;
  /** The lead soldered to this terminal, when it is a part terminal with a lead. */
  lead?: LeadSpec;
}

export type EdgeKind = 'lead' | 'cable' | 'bridge' | 'cross-connect' | 'contact';

export interface Edge {
  a: number;
  b: number;
  kind: EdgeKind;
  label: string;
  cable?: string;
  lead?: LeadSpec;
  /** Index into netlist.contacts for contact edges. */
  contact?: number;
}

export const COND_KEY = 0;
export const COND_OFF_HOOK = 1;
export const COND_NOT_HOLD = 2;
export const COND_HANDS_FREE = 3;

export interface ContactInfo {
  a: number;
  b: number;
  cond: number;
  /** Set whose mechanical state closes it (-1: never closes). */
  mech: number;
  key: number;
  part: number;
  label: string;
}

export interface ElementInfo {
  kind: ElementKind;
  a: number;
  b: number;
  part: number;
  /** Set whose user hears or sees through this element (-1: none). */
  owner: number;
  key?: number;
  /** For a ringer: the line it is strapped to. */
  line?: number;
  label: string;
}

export interface SetInfo {
  index: number;
  id: string;
  name: string;
  part: number;
  template: PartTemplate | undefined;
  station: string | undefined;
  /** Line of each key index (0 for hold/none), indexable by key index. */
  keyLine: number[];
  holdKey: number;
  fixedLines: number[];
  /** Add-on parts serving this set. */
  addOns: number[];
}

export interface LineInfo {
  number: number;
  directoryNumber: string;
  t: number;
  r: number;
  a: number;
  l: number;
}

export interface StationInfo {
  id: string;
  code: string;
  t: number;
  r: number;
}

export interface Netlist {
  plan: Plan;
  parts: PartInfo[];
  partById: Map<string, PartInfo>;
  sets: SetInfo[];
  setById: Map<string, SetInfo>;
  lines: LineInfo[];
  stations: StationInfo[];
  gnd: number;
  terminals: TerminalInfo[];
  /** Wires and contacts (contacts last). */
  edges: Edge[];
  contacts: ContactInfo[];
  elements: ElementInfo[];
  /** Terminal → static component (root terminal id). */
  staticRoot: Int32Array;
  /** Terminal → dense id among components that matter per state, or -1. */
  dense: Int32Array;
  denseCount: number;
  /** Hot-path copies: dense component ids of each contact's ends, its condition, set and key. */
  hot: { ca: Int32Array; cb: Int32Array; cond: Int32Array; mech: Int32Array; key: Int32Array; count: number };
  /** Scratch buffer for evaluateNets. */
  work: Int32Array;
  terminalIndex: Map<string, number>;
}

function find(parent: Int32Array, x: number): number {
  while (parent[x] !== x) {
    parent[x] = parent[parent[x]];
    x = parent[x];
  }
  return x;
}

const cache = new WeakMap<Plan, Netlist>();

/** The plan's netlist, built on first use (`cached: false`: with no part wiring reused, for tests). */
export function getNetlist(plan: Plan, options: { cached?: boolean } = {}): Netlist {
  let nl = cache.get(plan);
  if (!nl) {
    nl = buildNetlist(plan, options);
    cache.set(plan, nl);
  }
  return nl;
}

/** What the phases of buildNetlist fill in: parts, terminals, wires, contacts and loads, in creation order. */
interface Builder {
  parts: PartInfo[];
  partById: Map<string, PartInfo>;
  terminals: TerminalInfo[];
  terminalIndex: Map<string, number>;
  /** Per part and port: terminal id of each connector pin, -1 until asked for. */
  pinIds: (Map<string, Int32Array> | undefined)[];
  edges: Edge[];
  contactEdges: Edge[];
  contacts: ContactInfo[];
  elements: ElementInfo[];
  /** Reuse part wirings from earlier builds (see wireCached). */
  cached: boolean;
}

interface KsuTerminals {
  ksuPart: PartInfo;
  gnd: number;
  lines: LineInfo[];
  stations: StationInfo[];
}

function newBuilder(cached: boolean): Builder {
  return {
    cached,
    parts: [],
    partById: new Map(),
    terminals: [],
    terminalIndex: new Map(),
    pinIds: [],
    edges: [],
    contactEdges: [],
    contacts: [],
    elements: [],
  };
}

function addPart(
  b: Builder,
  id: string,
  name: string,
  kind: PartKind,
  template: PartTemplate | undefined,
): PartInfo {
  const p: PartInfo = { index: b.parts.length, id, name, kind, template, setIndex: -1, servesSet: -1 };
  b.parts.push(p);
  if (!b.partById.has(id)) b.partById.set(id, p);
  return p;
}

/** A part's terminal by name, made on first use; "port:pin" names are connector pins and carry their pair. */
function term(b: Builder, part: number, name: string): number {
  const key = `${part}|${name}`;
  let id = b.terminalIndex.get(key);
  if (id === undefined) {
    id = b.terminals.length;
    const info: TerminalInfo = { part, name };
    const colon = name.lastIndexOf(':');
    if (colon > 0) {
      const pin = Number(name.slice(colon + 1));
      if (Number.isInteger(pin) && pin >= 1 && pin <= PIN_COUNT) {
        info.port = name.slice(0, colon);
        info.pin = pin;
        const { pair, conductor } = pinToPair(pin);
        info.pair = pair;
        info.conductor = conductor;
      }
    }
    b.terminals.push(info);
    b.terminalIndex.set(key, id);
  }
  return id;
}

/** Connector pins are asked for often (every cable, bridge and lead): their ids are kept per part and port. */
function pinTerm(b: Builder, part: number, port: string, pin: number): number {
  if (!(pin >= 1 && pin <= PIN_COUNT)) return term(b, part, `${port}:${pin}`);
  const byPort = (b.pinIds[part] ??= new Map());
  let ids = byPort.get(port);
  if (!ids) {
    ids = new Int32Array(PIN_COUNT + 1).fill(-1);
    byPort.set(port, ids);
  }
  if (ids[pin] < 0) ids[pin] = term(b, part, `${port}:${pin}`);
  return ids[pin];
}

/**
 * The KSU's own terminals first: ground, each line circuit's T/R/A/L and each station's buzzer output (made on
 * the first call, found on the next).
 */
function ksuTerminals(b: Builder, plan: Plan, ksuPart: PartInfo): KsuTerminals {
  const k = ksuPart.index;
  const gnd = term(b, k, 'GND');
  const lines: LineInfo[] = plan.ksu.lines.map((l) => ({
    number: l.number,
    directoryNumber: l.directoryNumber,
    t: term(b, k, `L${l.number}.T`),
    r: term(b, k, `L${l.number}.R`),
    a: term(b, k, `L${l.number}.A`),
    l: term(b, k, `L${l.number}.L`),
  }));
  const stations: StationInfo[] = plan.ksu.stations.map((s) => ({
    id: s.id,
    code: s.code,
    t: term(b, k, `BZ.${s.id}.T`),
    r: term(b, k, `BZ.${s.id}.R`),
  }));
  return { ksuPart, gnd, lines, stations };
}

/** The KSU cross-connect: which line-circuit lead or buzzer output each pair of each station port carries. */
function wireCrossConnect(b: Builder, plan: Plan, ksu: KsuTerminals): void {
  const { ksuPart, gnd } = ksu;
  const lineByNumber = new Map(ksu.lines.map((l) => [l.number, l]));
  const stationById = new Map(ksu.stations.map((s) => [s.id, s]));
  for (const cc of effectiveCrossConnect(plan.ksu)) {
    if (cc.port > plan.ksu.ports) continue;
    const port = ksuPortName(cc.port);
    const tipPin = pinTerm(b, ksuPart.index, port, pinOf(cc.pair, 'tip'));
    const ringPin = pinTerm(b, ksuPart.index, port, pinOf(cc.pair, 'ring'));
    let tipTo: number;
    let ringTo: number;
    let what: string;
    const lead = cc.lead;
    if (lead.kind === 'buzzer') {
      const st = stationById.get(lead.station);
      if (!st) continue;
      tipTo = st.t;
      ringTo = st.r;
      what = `intercom buzzer output, station ${st.code}`;
    } else {
      const line = lineByNumber.get(lead.line);
      if (!line) continue;
      if (lead.kind === 'line-talk')
        [tipTo, ringTo, what] = [line.t, line.r, `line ${line.number} talk pair`];
      else if (lead.kind === 'line-a') [tipTo, ringTo, what] = [line.a, gnd, `line ${line.number} A / A1`];
      else if (lead.kind === 'line-lamp')
        [tipTo, ringTo, what] = [line.l, gnd, `line ${line.number} lamp L / LG`];
      else [tipTo, ringTo, what] = [line.a, line.l, `line ${line.number} A-lead and lamp lead`];
    }
    b.edges.push({ a: tipPin, b: tipTo, kind: 'cross-connect', label: `cross-connect: ${what} (tip)` });
    b.edges.push({ a: ringPin, b: ringTo, kind: 'cross-connect', label: `cross-connect: ${what} (ring)` });
  }
}

/** Set parts with their keys' lines, before any add-on, so an add-on can find the set it serves. */
function addSets(b: Builder, plan: Plan): SetInfo[] {
  const sets: SetInfo[] = [];
  for (const s of plan.sets) {
    const tpl = getTemplate(s.template);
    const p = addPart(b, s.id, s.name, 'set', tpl?.kind === 'set' ? tpl : undefined);
    p.setIndex = sets.length;
    const keyLine: number[] = [];
    let holdKey = 0;
    for (const k of p.template?.keys ?? []) {
      keyLine[k.index] = k.kind === 'line' ? (k.line ?? 0) : 0;
      if (k.kind === 'hold') holdKey = k.index;
    }
    for (let i = 0; i < keyLine.length; i++) keyLine[i] ??= 0;
    sets.push({
      index: sets.length,
      id: s.id,
      name: s.name,
      part: p.index,
      template: p.template,
      station: s.station,
      keyLine,
      holdKey,
      fixedLines: p.template?.fixedLines ?? [],
      addOns: [],
    });
  }
  return sets;
}

/** Add-on parts, each told which set it serves (its switch follows that set's hands-free state). */
function addAddOns(b: Builder, plan: Plan, setById: Map<string, SetInfo>): PartInfo[] {
  return plan.addOns.map((a) => {
    const tpl = getTemplate(a.template);
    const p = addPart(b, a.id, a.name, 'add-on', tpl?.kind === 'add-on' ? tpl : undefined);
    const served = setById.get(a.serves);
    if (served) {
      p.servesSet = served.index;
      served.addOns.push(p.index);
    }
    return p;
  });
}

function addAdapters(b: Builder, plan: Plan): PartInfo[] {
  return plan.adapters.map((a) => {
    const tpl = getTemplate(a.template);
    return addPart(b, a.id, a.name, 'adapter', tpl?.kind === 'adapter' ? tpl : undefined);
  });
}

/** Each lead from its terminal to the cord pin where the part's lead changes leave it (lifted leads: no wire). */
function wireLeads(b: Builder, p: PartInfo, tpl: PartTemplate, changes: readonly LeadChange[]): void {
  if (!tpl.leadPort) return;
  const at = applyLeadChanges(tpl.leads, changes);
  tpl.leads.forEach((lead, i) => {
    const t = term(b, p.index, lead.terminal);
    b.terminals[t].lead ??= lead;
    const pair = at[i];
    if (pair === null) return;
    const pin = pinTerm(b, p.index, tpl.leadPort!, pinOf(pair, lead.conductor));
    const moved = pair !== lead.pair ? ` (moved to pair ${pair}, ${pairColour(pair).name})` : '';
    b.edges.push({ a: t, b: pin, kind: 'lead', label: `lead ${lead.designation}${moved}`, lead });
  });
}

/** Ports an adapter (or an add-on's pass-through) parallels pin for pin; an adapter may bridge only some pairs. */
function wireBridges(b: Builder, p: PartInfo, tpl: PartTemplate, bridgedPairs?: number[]): void {
  for (const group of tpl.bridges ?? []) {
    const pairs = bridgedPairs ?? Array.from({ length: 25 }, (_, i) => i + 1);
    for (const pair of pairs) {
      for (const conductor of ['tip', 'ring'] as const) {
        const pin = pinOf(pair, conductor);
        const first = pinTerm(b, p.index, group[0], pin);
        for (let g = 1; g < group.length; g++) {
          b.edges.push({
            a: first,
            b: pinTerm(b, p.index, group[g], pin),
            kind: 'bridge',
            label: `bridged inside ${p.name}`,
          });
        }
      }
    }
  }
}

function conditionCode(when: PartTemplate['contacts'][number]['when']): number {
  if (typeof when === 'object') return COND_KEY;
  if (when === 'offHook') return COND_OFF_HOOK;
  return when === 'notHoldPressed' ? COND_NOT_HOLD : COND_HANDS_FREE;
}

/** Contacts, with the set whose keys, hookswitch or hands-free switch close them; kept apart, they go last. */
function addContacts(b: Builder, p: PartInfo, tpl: PartTemplate, ownerSet: number): void {
  for (const c of tpl.contacts) {
    const a = term(b, p.index, c.a);
    const z = term(b, p.index, c.b);
    const index = b.contacts.length;
    b.contacts.push({
      a,
      b: z,
      cond: conditionCode(c.when),
      mech: ownerSet,
      key: typeof c.when === 'object' ? c.when.key : 0,
      part: p.index,
      label: c.label,
    });
    b.contactEdges.push({ a, b: z, kind: 'contact', label: c.label, contact: index });
  }
}

/** Loads (networks, lamps, buzzers), owned by the set whose user hears or sees them. */
function addElements(b: Builder, p: PartInfo, tpl: PartTemplate, ownerSet: number): void {
  for (const e of tpl.elements) {
    b.elements.push({
      kind: e.kind,
      a: term(b, p.index, e.a),
      b: term(b, p.index, e.b),
      part: p.index,
      owner: ownerSet,
      key: e.key,
      label: e.label,
    });
  }
}

/** One part's template in place: leads (lead changes applied), bridges, contacts, loads, in that order. */
function wirePart(
  b: Builder,
  p: PartInfo,
  changes: readonly LeadChange[],
  ownerSet: number,
  bridgedPairs?: number[],
): void {
  const tpl = p.template;
  if (!tpl) return;
  wireLeads(b, p, tpl, changes);
  wireBridges(b, p, tpl, bridgedPairs);
  addContacts(b, p, tpl, ownerSet);
  addElements(b, p, tpl, ownerSet);
}

/** A set's ringers: one load per line the plan straps it to, across that line's strap terminals. */
function addRingers(b: Builder, p: PartInfo, set: SetInfo, ringerLines: readonly number[]): void {
  for (const line of ringerLines) {
    const strap = p.template?.ringerStraps?.find((r) => r.line === line);
    if (!strap) continue;
    b.elements.push({
      kind: 'ringer',
      a: term(b, p.index, strap.tip),
      b: term(b, p.index, strap.ring),
      part: p.index,
      owner: set.index,
      line,
      label: `Ringer strapped to line ${line}`,
    });
  }
}

/** What one part's wiring added to the builder, made at terminal id `termBase` and contact index `contactBase`. */
interface PartWiring {
  termBase: number;
  contactBase: number;
  terminals: TerminalInfo[];
  termNames: string[];
  pinIds: Map<string, Int32Array> | undefined;
  edges: Edge[];
  contactEdges: Edge[];
  contacts: ContactInfo[];
  elements: ElementInfo[];
}

/**
 * Part wirings by content (the KSU's with its cross-connect too): after an edit in the Bench (one part at a time, a
 * new plan object) every other part is wired exactly as before. A part's terminals are all made while it is wired, so its wiring depends only on its
 * own data, its index and the set that owns it (all in the key), up to where its terminal ids and contact indices
 * start: a hit made at the same ids pushes the same objects again, one made elsewhere pushes them shifted. Either
 * way equal to what a fresh build makes. Netlists never change after build, so sharing the objects is safe.
 */
const partWirings = new Map<string, PartWiring>();
/** Least recently used go first (Map order): enough for a few versions of a large plan, a few MB at most. */
const PART_WIRINGS_MAX = 512;

const shiftEdge = (e: Edge, dt: number, dc: number): Edge =>
  e.contact === undefined
    ? { ...e, a: e.a + dt, b: e.b + dt }
    : { ...e, a: e.a + dt, b: e.b + dt, contact: e.contact + dc };

function pushWiring(b: Builder, p: PartInfo, w: PartWiring): void {
  const dt = b.terminals.length - w.termBase;
  const dc = b.contacts.length - w.contactBase;
  for (const t of w.terminals) b.terminals.push(t);
  w.termNames.forEach((name, i) => b.terminalIndex.set(name, b.terminals.length - w.terminals.length + i));
  if (w.pinIds) {
    const byPort = new Map<string, Int32Array>();
    for (const [port, ids] of w.pinIds) byPort.set(port, ids.map((id) => (id < 0 ? id : id + dt)));
    b.pinIds[p.index] = byPort;
  }
  if (dt === 0 && dc === 0) {
    for (const e of w.edges) b.edges.push(e);
    for (const e of w.contactEdges) b.contactEdges.push(e);
    for (const c of w.contacts) b.contacts.push(c);
    for (const e of w.elements) b.elements.push(e);
    return;
  }
  for (const e of w.edges) b.edges.push(shiftEdge(e, dt, dc));
  for (const e of w.contactEdges) b.contactEdges.push(shiftEdge(e, dt, dc));
  for (const c of w.contacts) b.contacts.push({ ...c, a: c.a + dt, b: c.b + dt });
  for (const e of w.elements) b.elements.push({ ...e, a: e.a + dt, b: e.b + dt });
}

function wireCached(b: Builder, p: PartInfo, data: unknown, ownerSet: number, wire: () => void): void {
  if (!b.cached) return wire();
  const key = `${p.index}|${ownerSet}|${p.kind}|${JSON.stringify(data)}`;
  const hit = partWirings.get(key);
  if (hit) {
    partWirings.delete(key);
    partWirings.set(key, hit);
    return pushWiring(b, p, hit);
  }
  const at = [b.terminals.length, b.edges.length, b.contactEdges.length, b.contacts.length, b.elements.length];
  wire();
  const terminals = b.terminals.slice(at[0]);
  const pins = b.pinIds[p.index];
  if (partWirings.size >= PART_WIRINGS_MAX) partWirings.delete(partWirings.keys().next().value!);
  partWirings.set(key, {
    termBase: at[0],
    contactBase: at[3],
    terminals,
    termNames: terminals.map((t) => `${p.index}|${t.name}`),
    // as the part left them: cables fill in more pins later, on the builder's copy
    pinIds: pins && new Map([...pins].map(([port, ids]) => [port, ids.slice()])),
    edges: b.edges.slice(at[1]),
    contactEdges: b.contactEdges.slice(at[2]),
    contacts: b.contacts.slice(at[3]),
    elements: b.elements.slice(at[4]),
  });
}

/** Every part's wiring: sets (then their ringers), add-ons, adapters, in plan order. */
function wireParts(
  b: Builder,
  plan: Plan,
  sets: SetInfo[],
  addOnParts: PartInfo[],
  adapterParts: PartInfo[],
) {
  plan.sets.forEach((s, i) => {
    const info = sets[i];
    const p = b.parts[info.part];
    wireCached(b, p, s, info.index, () => {
      wirePart(b, p, s.leadChanges, info.index);
      addRingers(b, p, info, s.ringerLines);
    });
  });
  plan.addOns.forEach((a, i) => {
    const p = addOnParts[i];
    wireCached(b, p, a, p.servesSet, () => wirePart(b, p, a.leadChanges, p.servesSet));
  });
  plan.adapters.forEach((a, i) => {
    const p = adapterParts[i];
    wireCached(b, p, a, -1, () => wirePart(b, p, [], -1, a.bridgedPairs));
  });
}

function portExists(plan: Plan, part: PartInfo, port: string): boolean {
  if (part.kind === 'ksu') {
    const m = /^port-(\d+)$/.exec(port);
    return !!m && Number(m[1]) >= 1 && Number(m[1]) <= plan.ksu.ports;
  }
  return !!part.template?.ports.some((pt) => pt.name === port);
}

/** Cables: pin for pin between two existing ports (a cable to a missing part or port carries nothing). */
function wireCables(b: Builder, plan: Plan): void {
  for (const c of plan.cables) {
    const from = b.partById.get(c.from.part);
    const to = b.partById.get(c.to.part);
    if (!from || !to || !portExists(plan, from, c.from.port) || !portExists(plan, to, c.to.port)) continue;
    // Pin for pin, with the cable's wiring faults (split, reversed, open) applied: see cable-faults.ts.
    for (const w of cableWires(c)) {
      b.edges.push({
        a: pinTerm(b, from.index, c.from.port, w.fromPin),
        b: pinTerm(b, to.index, c.to.port, w.toPin),
        kind: 'cable',
        label: `cable ${c.label || c.id}${w.note}`,
        cable: c.id,
      });
    }
  }
}

/** Wires never change with the state, so their connectivity is solved once: terminal → static root. */
function staticComponents(n: number, edges: readonly Edge[]): Int32Array {
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  for (const e of edges) {
    const ra = find(parent, e.a);
    const rb = find(parent, e.b);
    if (ra !== rb) parent[ra] = rb;
  }
  const staticRoot = new Int32Array(n);
  for (let i = 0; i < n; i++) staticRoot[i] = find(parent, i);
  return staticRoot;
}

/**
 * Dense ids for the static components the state can change or the observations read (KSU leads, loads, contact
 * ends), and the contacts that can join two of them, as flat arrays for the per-state union (nets.ts).
 */
function denseComponents(
  b: Builder,
  ksu: KsuTerminals,
  staticRoot: Int32Array,
): Pick<Netlist, 'dense' | 'denseCount' | 'hot'> {
  const n = b.terminals.length;
  const dense = new Int32Array(n).fill(-1);
  // static root → dense id (-1: none yet); roots are terminal ids
  const rootDense = new Int32Array(n).fill(-1);
  let denseCount = 0;
  const mark = (t: number): number => {
    const r = staticRoot[t];
    let d = rootDense[r];
    if (d < 0) d = rootDense[r] = denseCount++;
    dense[t] = d;
    return d;
  };
  mark(ksu.gnd);
  for (const l of ksu.lines) [l.t, l.r, l.a, l.l].forEach(mark);
  for (const s of ksu.stations) [s.t, s.r].forEach(mark);
  for (const e of b.elements) {
    mark(e.a);
    mark(e.b);
  }
  const hotList: ContactInfo[] = [];
  for (const c of b.contacts) {
    const da = mark(c.a);
    const db = mark(c.b);
    if (da !== db && c.mech >= 0) hotList.push(c);
  }
  for (let i = 0; i < n; i++) if (dense[i] < 0) dense[i] = rootDense[staticRoot[i]];
  const hot = {
    ca: Int32Array.from(hotList, (c) => dense[c.a]),
    cb: Int32Array.from(hotList, (c) => dense[c.b]),
    cond: Int32Array.from(hotList, (c) => c.cond),
    mech: Int32Array.from(hotList, (c) => c.mech),
    key: Int32Array.from(hotList, (c) => c.key),
    count: hotList.length,
  };
  return { dense, denseCount, hot };
}

/**
 * The phases in the order terminals and edges are made (ids and edge order follow it, and so do paths). With
 * `cached: false` every part is wired afresh (tests compare the two).
 */
export function buildNetlist(plan: Plan, options: { cached?: boolean } = {}): Netlist {
  const b = newBuilder(options.cached !== false);
  const ksuPart = addPart(b, plan.ksu.id, plan.ksu.name, 'ksu', getTemplate('ksu'));
  wireCached(b, ksuPart, plan.ksu, -1, () => wireCrossConnect(b, plan, ksuTerminals(b, plan, ksuPart)));
  const ksu = ksuTerminals(b, plan, ksuPart);
  const sets = addSets(b, plan);
  const setById = new Map(sets.map((s) => [s.id, s]));
  const addOnParts = addAddOns(b, plan, setById);
  const adapterParts = addAdapters(b, plan);
  wireParts(b, plan, sets, addOnParts, adapterParts);
  wireCables(b, plan);
  const staticRoot = staticComponents(b.terminals.length, b.edges);
  const { dense, denseCount, hot } = denseComponents(b, ksu, staticRoot);
  return {
    plan,
    parts: b.parts,
    partById: b.partById,
    sets,
    setById,
    lines: ksu.lines,
    stations: ksu.stations,
    gnd: ksu.gnd,
    terminals: b.terminals,
    edges: b.edges.concat(b.contactEdges),
    contacts: b.contacts,
    elements: b.elements,
    staticRoot,
    dense,
    denseCount,
    hot,
    work: new Int32Array(denseCount),
    terminalIndex: b.terminalIndex,
  };
}
