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
/** Netlist.edgeKind codes: the index of the kind here. */
export const EDGE_KINDS: readonly EdgeKind[] = ['lead', 'cable', 'bridge', 'cross-connect', 'contact'];
export const KIND_LEAD = 0;
export const KIND_CABLE = 1;
export const KIND_BRIDGE = 2;
export const KIND_CROSS_CONNECT = 3;
export const KIND_CONTACT = 4;

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
  /** The edges' ends, kinds (EDGE_KINDS index) and contacts (-1: a wire) as flat arrays, for the loops over all. */
  edgeA: Int32Array;
  edgeB: Int32Array;
  edgeKind: Uint8Array;
  edgeContact: Int32Array;
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
  /** "part index|terminal name" → terminal id, made when first read (terminalId looks one up without it). */
  readonly terminalIndex: Map<string, number>;
  /** Per part: named terminals and pin ids per port (what terminalId reads). */
  partTerminals: { names: Map<string, number> | undefined; pinIds: Map<string, Int32Array> | undefined }[];
}

/** A part's terminal by name ("port:pin" for a connector pin), or -1. */
export function terminalId(nl: Netlist, part: number, name: string): number {
  const at = nl.partTerminals[part];
  if (!at) return -1;
  const pin = pinOfName(name);
  if (pin) {
    const id = at.pinIds?.get(pin.port)?.[pin.pin] ?? -1;
    if (id >= 0) return id;
  }
  return at.names?.get(name) ?? -1;
}

const terminalIndexes = new WeakMap<Netlist, Map<string, number>>();

function terminalIndexOf(nl: Netlist): Map<string, number> {
  let index = terminalIndexes.get(nl);
  if (!index) {
    index = new Map(nl.terminals.map((t, i) => [`${t.part}|${t.name}`, i]));
    terminalIndexes.set(nl, index);
  }
  return index;
}

/** A value made from a netlist on first use and kept with it (a netlist never changes once built). */
export function perNetlist<T>(make: (nl: Netlist) => T): (nl: Netlist) => T {
  const made = new WeakMap<Netlist, T>();
  return (nl) => {
    let value = made.get(nl);
    if (value === undefined) made.set(nl, (value = make(nl)));
    return value;
  };
}

/** The root of x in a union-find forest, halving the path on the way. */
export function findRoot(parent: Int32Array, x: number): number {
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
    nl = (options.cached !== false && lastBuilt && rewiredFrom(lastBuilt, plan)) || buildNetlist(plan, options);
    cache.set(plan, nl);
    if (options.cached !== false) lastBuilt = nl;
  }
  return nl;
}

/** What the phases of buildNetlist fill in: parts, terminals, wires, contacts and loads, in creation order. */
interface Builder {
  parts: PartInfo[];
  partById: Map<string, PartInfo>;
  terminals: TerminalInfo[];
  /** Per part: its named (non-pin) terminals by name. */
  names: (Map<string, number> | undefined)[];
  /** Per part and port: terminal id of each connector pin, -1 until asked for. */
  pinIds: (Map<string, Int32Array> | undefined)[];
  /** Parts whose names / pinIds maps are shared with a cached wiring (copied before they change). */
  shared: Set<number>;
  edges: Edge[];
  contactEdges: Edge[];
  contacts: ContactInfo[];
  elements: ElementInfo[];
  /** Reuse part wirings from earlier builds (see wireCached). */
  cached: boolean;
  /** Runs of edges and contact edges whose flat copies were made with an earlier wiring (see flatOf). */
  wireRuns: FlatRun[];
  contactRuns: FlatRun[];
}

/** A run of edges pushed from a cached wiring at `at`, with its flat copy, shifted by dt terminals and dc contacts. */
interface FlatRun {
  at: number;
  flat: FlatEdges;
  dt: number;
  dc: number;
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
    names: [],
    pinIds: [],
    shared: new Set(),
    edges: [],
    contactEdges: [],
    contacts: [],
    elements: [],
    wireRuns: [],
    contactRuns: [],
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

/** Port and pin when `name` is "port:pin" with a pin of the 25-pair connector, else null. */
function pinOfName(name: string): { port: string; pin: number } | null {
  const colon = name.lastIndexOf(':');
  if (colon <= 0) return null;
  const pin = Number(name.slice(colon + 1));
  return Number.isInteger(pin) && pin >= 1 && pin <= PIN_COUNT ? { port: name.slice(0, colon), pin } : null;
}

/** Before a part's names or pin ids change, stop sharing them with the cached wiring they came from. */
function ownMaps(b: Builder, part: number): void {
  if (!b.shared.delete(part)) return;
  const names = b.names[part];
  if (names) b.names[part] = new Map(names);
  const pins = b.pinIds[part];
  if (pins) b.pinIds[part] = new Map([...pins].map(([port, ids]) => [port, ids.slice()]));
}

/**
 * Every terminal, wire and load object has all its fields, in one order: the loops over thousands of them (static
 * components, adjacency, finding rules) then read one object shape, not several.
 */
const terminalInfo = (part: number, name: string): TerminalInfo => ({
  part,
  name,
  port: undefined,
  pin: undefined,
  pair: undefined,
  conductor: undefined,
  lead: undefined,
});

const edge = (
  a: number,
  b: number,
  kind: EdgeKind,
  label: string,
  more: Pick<Edge, 'cable' | 'lead' | 'contact'> = {},
): Edge => ({ a, b, kind, label, cable: more.cable, lead: more.lead, contact: more.contact });

function newTerminal(b: Builder, info: TerminalInfo): number {
  b.terminals.push(info);
  return b.terminals.length - 1;
}

/** A part's terminal by name, made on first use; "port:pin" names are connector pins and carry their pair. */
function term(b: Builder, part: number, name: string): number {
  const pin = pinOfName(name);
  if (pin) return pinTerm(b, part, pin.port, pin.pin);
  const id = b.names[part]?.get(name);
  if (id !== undefined) return id;
  ownMaps(b, part);
  const made = newTerminal(b, terminalInfo(part, name));
  (b.names[part] ??= new Map()).set(name, made);
  return made;
}

/** Connector pins are asked for often (every cable, bridge and lead): their ids are kept per part and port. */
function pinTerm(b: Builder, part: number, port: string, pin: number): number {
  if (!(pin >= 1 && pin <= PIN_COUNT)) return term(b, part, `${port}:${pin}`);
  const known = b.pinIds[part]?.get(port);
  if (known && known[pin] >= 0) return known[pin];
  ownMaps(b, part);
  const byPort = (b.pinIds[part] ??= new Map());
  let ids = byPort.get(port);
  if (!ids) {
    ids = new Int32Array(PIN_COUNT + 1).fill(-1);
    byPort.set(port, ids);
  }
  const { pair, conductor } = pinToPair(pin);
  ids[pin] = newTerminal(b, { ...terminalInfo(part, `${port}:${pin}`), port, pin, pair, conductor });
  return ids[pin];
}

/**
 * Every pin of each of a part's ports, made before anything else of the part: a part then has the same terminals
 * whatever its lead changes and whatever is cabled to it, so an edit leaves every other part's terminal ids as
 * they were (and their cached wiring reusable as it is).
 */
function allPins(b: Builder, part: number, ports: readonly string[]): void {
  for (const port of ports) for (let pin = 1; pin <= PIN_COUNT; pin++) pinTerm(b, part, port, pin);
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
  allPins(
    b,
    ksuPart.index,
    Array.from({ length: plan.ksu.ports }, (_, i) => ksuPortName(i + 1)),
  );
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
    b.edges.push(edge(tipPin, tipTo, 'cross-connect', `cross-connect: ${what} (tip)`));
    b.edges.push(edge(ringPin, ringTo, 'cross-connect', `cross-connect: ${what} (ring)`));
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
    b.edges.push(edge(t, pin, 'lead', `lead ${lead.designation}${moved}`, { lead }));
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
          b.edges.push(edge(first, pinTerm(b, p.index, group[g], pin), 'bridge', `bridged inside ${p.name}`));
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
    b.contactEdges.push(edge(a, z, 'contact', c.label, { contact: index }));
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
      line: undefined,
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
  allPins(
    b,
    p.index,
    tpl.ports.map((pt) => pt.name),
  );
  wireLeads(b, p, tpl, changes);
  wireBridges(b, p, tpl, bridgedPairs);
  addContacts(b, p, tpl, ownerSet);
  addElements(b, p, tpl, ownerSet);
}

/** A set's ringers: one load per line the plan straps it to, across that line's strap terminals. */
function addRingers(b: Builder, p: PartInfo, set: SetInfo, ringerLines: readonly number[]): void {
  // every strap's terminals, strapped or not: the part's terminals do not depend on its straps
  for (const strap of p.template?.ringerStraps ?? []) {
    term(b, p.index, strap.tip);
    term(b, p.index, strap.ring);
  }
  for (const line of ringerLines) {
    const strap = p.template?.ringerStraps?.find((r) => r.line === line);
    if (!strap) continue;
    b.elements.push({
      kind: 'ringer',
      a: term(b, p.index, strap.tip),
      b: term(b, p.index, strap.ring),
      part: p.index,
      owner: set.index,
      key: undefined,
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
  names: Map<string, number> | undefined;
  pinIds: Map<string, Int32Array> | undefined;
  edges: Edge[];
  contactEdges: Edge[];
  contacts: ContactInfo[];
  elements: ElementInfo[];
  /** Flat copies of edges and contactEdges. */
  flat: FlatEdges;
  contactFlat: FlatEdges;
}

/**
 * Part wirings by content (the KSU's with its cross-connect too): after an edit in the Bench (one part at a time, a
 * new plan object) every other part is wired exactly as before. A part's terminals are all made while it is wired,
 * and how many depends on its template alone (allPins, addRingers), so its wiring depends only on its own data, its
 * index and the set that owns it (all in the key), up to where its terminal ids and contact indices start: a hit
 * made at the same ids pushes the same objects again, one made elsewhere (after a part whose template changed)
 * pushes them shifted. Either way equal to what a fresh build makes. Netlists never change after build, so sharing
 * the objects is safe.
 */
const partWirings = new Map<string, PartWiring>();
/** Least recently used go first (Map order): enough for a few versions of a large plan, a few MB at most. */
const PART_WIRINGS_MAX = 512;

/** A plan part's content as text, made once per part object (plans are never changed in place). */
const contentKeys = new WeakMap<object, string>();
export function contentKey(data: object): string {
  let key = contentKeys.get(data);
  if (key === undefined) {
    key = JSON.stringify(data);
    contentKeys.set(data, key);
  }
  return key;
}

/** Least recently used entries go first once a cache holds `max` (Map order). */
function lruGet<T>(cache: Map<string, T>, key: string): T | undefined {
  const hit = cache.get(key);
  if (hit !== undefined) {
    cache.delete(key);
    cache.set(key, hit);
  }
  return hit;
}

function lruSet<T>(cache: Map<string, T>, key: string, value: T, max: number): void {
  if (cache.size >= max) cache.delete(cache.keys().next().value!);
  cache.set(key, value);
}

const shiftEdge = (e: Edge, dt: number, dc: number): Edge =>
  e.contact === undefined
    ? { ...e, a: e.a + dt, b: e.b + dt }
    : { ...e, a: e.a + dt, b: e.b + dt, contact: e.contact + dc };

const shiftIds = (ids: Int32Array, dt: number) => ids.map((id) => (id < 0 ? id : id + dt));

function pushWiring(b: Builder, p: PartInfo, w: PartWiring): void {
  const dt = b.terminals.length - w.termBase;
  const dc = b.contacts.length - w.contactBase;
  // one part has a few hundred of each at most: push(...) copies them in one go
  b.terminals.push(...w.terminals);
  b.wireRuns.push({ at: b.edges.length, flat: w.flat, dt, dc });
  b.contactRuns.push({ at: b.contactEdges.length, flat: w.contactFlat, dt, dc });
  if (dt === 0) {
    b.names[p.index] = w.names;
    b.pinIds[p.index] = w.pinIds;
    b.shared.add(p.index);
  } else {
    b.names[p.index] = w.names && new Map([...w.names].map(([n, id]) => [n, id + dt]));
    b.pinIds[p.index] = w.pinIds && new Map([...w.pinIds].map(([port, ids]) => [port, shiftIds(ids, dt)]));
  }
  if (dt === 0 && dc === 0) {
    b.edges.push(...w.edges);
    b.contactEdges.push(...w.contactEdges);
    b.contacts.push(...w.contacts);
    b.elements.push(...w.elements);
    return;
  }
  for (const e of w.edges) b.edges.push(shiftEdge(e, dt, dc));
  for (const e of w.contactEdges) b.contactEdges.push(shiftEdge(e, dt, dc));
  for (const c of w.contacts) b.contacts.push({ ...c, a: c.a + dt, b: c.b + dt });
  for (const e of w.elements) b.elements.push({ ...e, a: e.a + dt, b: e.b + dt });
}

/** The last wiring made or found for a part object, with the index and owner it was made for. */
const wiringByObject = new WeakMap<object, { at: string; wiring: PartWiring }>();

function wireCached(b: Builder, p: PartInfo, data: object, ownerSet: number, wire: () => void): void {
  if (!b.cached) return wire();
  const at = `${p.index}|${ownerSet}|${p.kind}`;
  const same = wiringByObject.get(data);
  if (same?.at === at) return pushWiring(b, p, same.wiring);
  const key = `${at}|${contentKey(data)}`;
  const hit = lruGet(partWirings, key);
  if (hit) {
    wiringByObject.set(data, { at, wiring: hit });
    return pushWiring(b, p, hit);
  }
  const from = [
    b.terminals.length,
    b.edges.length,
    b.contactEdges.length,
    b.contacts.length,
    b.elements.length,
  ];
  wire();
  const names = b.names[p.index];
  const pins = b.pinIds[p.index];
  const wiring: PartWiring = {
    termBase: from[0],
    contactBase: from[3],
    terminals: b.terminals.slice(from[0]),
    // copies: the builder's own maps stay the builder's
    names: names && new Map(names),
    pinIds: pins && new Map([...pins].map(([port, ids]) => [port, ids.slice()])),
    edges: b.edges.slice(from[1]),
    contactEdges: b.contactEdges.slice(from[2]),
    contacts: b.contacts.slice(from[3]),
    elements: b.elements.slice(from[4]),
    flat: flatEdges(b.edges, from[1]),
    contactFlat: flatEdges(b.contactEdges, from[2]),
  };
  lruSet(partWirings, key, wiring, PART_WIRINGS_MAX);
  wiringByObject.set(data, { at, wiring });
}

/** Every part's wiring: sets (then their ringers), add-ons, adapters, in plan order. */
function wireParts(
  b: Builder,
  plan: Plan,
  sets: SetInfo[],
  addOnParts: PartInfo[],
  adapterParts: PartInfo[],
) {
  const wireStart = new Int32Array(b.parts.length).fill(-1);
  plan.sets.forEach((s, i) => {
    const info = sets[i];
    const p = b.parts[info.part];
    wireStart[p.index] = b.edges.length;
    wireCached(b, p, s, info.index, () => {
      wirePart(b, p, s.leadChanges, info.index);
      addRingers(b, p, info, s.ringerLines);
    });
  });
  plan.addOns.forEach((a, i) => {
    const p = addOnParts[i];
    wireStart[p.index] = b.edges.length;
    wireCached(b, p, a, p.servesSet, () => wirePart(b, p, a.leadChanges, p.servesSet));
  });
  plan.adapters.forEach((a, i) => {
    const p = adapterParts[i];
    wireCached(b, p, a, -1, () => wirePart(b, p, [], -1, a.bridgedPairs));
  });
  return wireStart;
}

function portExists(plan: Plan, part: PartInfo, port: string): boolean {
  if (part.kind === 'ksu') {
    const m = /^port-(\d+)$/.exec(port);
    return !!m && Number(m[1]) >= 1 && Number(m[1]) <= plan.ksu.ports;
  }
  return !!part.template?.ports.some((pt) => pt.name === port);
}

/**
 * Each cable's wires by content and by the terminal ids its two ports start at (every port's pins are made
 * together, in pin order): an edit elsewhere leaves both, and the cable's wires are the same objects again.
 */
const cableWirings = new Map<string, CableWiring>();
const CABLE_WIRINGS_MAX = 2048;
const cableByObject = new WeakMap<object, { at: string; wiring: CableWiring }>();

interface CableWiring {
  edges: Edge[];
  flat: FlatEdges;
}

/** The cable's wires, and their flat copy when they are a cached wiring (null: made for this build only). */
function cableEdges(
  b: Builder,
  c: Plan['cables'][number],
  from: PartInfo,
  to: PartInfo,
): { edges: Edge[]; flat: FlatEdges | null } {
  const wire = () =>
    // Pin for pin, with the cable's wiring faults (split, reversed, open) applied: see cable-faults.ts.
    cableWires(c).map((w): Edge =>
      edge(
        pinTerm(b, from.index, c.from.port, w.fromPin),
        pinTerm(b, to.index, c.to.port, w.toPin),
        'cable',
        `cable ${c.label || c.id}${w.note}`,
        { cable: c.id },
      ),
    );
  const first = [pinTerm(b, from.index, c.from.port, 1), pinTerm(b, to.index, c.to.port, 1)];
  const last = [pinTerm(b, from.index, c.from.port, PIN_COUNT), pinTerm(b, to.index, c.to.port, PIN_COUNT)];
  // the ports' pins in one run of ids (allPins), so the first pin's ids say where all of them are
  const runs = last[0] - first[0] === PIN_COUNT - 1 && last[1] - first[1] === PIN_COUNT - 1;
  if (!b.cached || !runs) return { edges: wire(), flat: null };
  const at = `${first[0]}|${first[1]}`;
  const same = cableByObject.get(c);
  if (same?.at === at) return same.wiring;
  const key = `${at}|${contentKey(c)}`;
  let wiring = lruGet(cableWirings, key);
  if (!wiring) {
    const edges = wire();
    lruSet(cableWirings, key, (wiring = { edges, flat: flatEdges(edges, 0) }), CABLE_WIRINGS_MAX);
  }
  cableByObject.set(c, { at, wiring });
  return wiring;
}

/** Cables: pin for pin between two existing ports (a cable to a missing part or port carries nothing). */
function wireCables(b: Builder, plan: Plan): void {
  for (const c of plan.cables) {
    const from = b.partById.get(c.from.part);
    const to = b.partById.get(c.to.part);
    if (!from || !to || !portExists(plan, from, c.from.port) || !portExists(plan, to, c.to.port)) continue;
    const { edges, flat } = cableEdges(b, c, from, to);
    if (flat) b.wireRuns.push({ at: b.edges.length, flat, dt: 0, dc: 0 });
    b.edges.push(...edges);
  }
}

type FlatEdges = Pick<Netlist, 'edgeA' | 'edgeB' | 'edgeKind' | 'edgeContact'>;

const KIND_CODE: Record<EdgeKind, number> = {
  lead: KIND_LEAD,
  cable: KIND_CABLE,
  bridge: KIND_BRIDGE,
  'cross-connect': KIND_CROSS_CONNECT,
  contact: KIND_CONTACT,
};

const newFlat = (m: number): FlatEdges => ({
  edgeA: new Int32Array(m),
  edgeB: new Int32Array(m),
  edgeKind: new Uint8Array(m),
  edgeContact: new Int32Array(m),
});

/** edges[from..to) into `out` from `at` on, read off the edge objects. */
function flatInto(out: FlatEdges, at: number, edges: readonly Edge[], from: number, to: number): void {
  for (let i = from; i < to; i++) {
    const e = edges[i];
    const k = at + i - from;
    out.edgeA[k] = e.a;
    out.edgeB[k] = e.b;
    out.edgeKind[k] = KIND_CODE[e.kind];
    out.edgeContact[k] = e.contact ?? -1;
  }
}

/** The edges from `from` on, as flat arrays. */
function flatEdges(edges: readonly Edge[], from: number): FlatEdges {
  const flat = newFlat(edges.length - from);
  flatInto(flat, 0, edges, from, edges.length);
  return flat;
}

/** A cached wiring's flat copy into `out` at `at`, shifted as its edges were (shiftEdge). */
function copyRun(out: FlatEdges, at: number, run: FlatRun): void {
  const { flat, dt, dc } = run;
  out.edgeKind.set(flat.edgeKind, at);
  if (dt === 0 && dc === 0) {
    out.edgeA.set(flat.edgeA, at);
    out.edgeB.set(flat.edgeB, at);
    out.edgeContact.set(flat.edgeContact, at);
    return;
  }
  for (let i = 0; i < flat.edgeA.length; i++) {
    out.edgeA[at + i] = flat.edgeA[i] + dt;
    out.edgeB[at + i] = flat.edgeB[i] + dt;
    const c = flat.edgeContact[i];
    out.edgeContact[at + i] = c < 0 ? c : c + dc;
  }
}

/**
 * The flat arrays of all edges (wires, then contacts): one pass over the edge objects, except for runs pushed from
 * cached wirings, which are copied from their flat copies. Every later loop over all edges reads these.
 */
function flatOf(b: Builder): FlatEdges {
  const wires = b.edges.length;
  const out = newFlat(wires + b.contactEdges.length);
  const fill = (base: number, edges: readonly Edge[], runs: readonly FlatRun[]) => {
    let done = 0;
    for (const run of runs) {
      flatInto(out, base + done, edges, done, run.at);
      copyRun(out, base + run.at, run);
      done = run.at + run.flat.edgeA.length;
    }
    flatInto(out, base + done, edges, done, edges.length);
  };
  fill(0, b.edges, b.wireRuns);
  fill(wires, b.contactEdges, b.contactRuns);
  return out;
}

/** Wires never change with the state, so their connectivity is solved once: terminal → static root. */
function staticComponents(n: number, flat: FlatEdges, wires: number): Int32Array {
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  const { edgeA, edgeB } = flat;
  for (let k = 0; k < wires; k++) {
    const ra = findRoot(parent, edgeA[k]);
    const rb = findRoot(parent, edgeB[k]);
    if (ra !== rb) parent[ra] = rb;
  }
  // in place: every entry becomes its root
  for (let i = 0; i < n; i++) parent[i] = findRoot(parent, i);
  return parent;
}

/**
 * Dense ids for the static components the state can change or the observations read (KSU leads, loads, contact
 * ends), and the contacts that can join two of them, as flat arrays for the per-state union (nets.ts).
 */
let rootBuffer = new Int32Array(0);

function denseComponents(
  b: Pick<Builder, 'terminals' | 'elements' | 'contacts'>,
  ksu: Pick<KsuTerminals, 'gnd' | 'lines' | 'stations'>,
  staticRoot: Int32Array,
): Pick<Netlist, 'dense' | 'denseCount' | 'hot'> {
  const n = b.terminals.length;
  const dense = new Int32Array(n).fill(-1);
  // static root → dense id (-1: none yet); roots are terminal ids. Scratch: builds are synchronous.
  if (rootBuffer.length < n) rootBuffer = new Int32Array(n);
  const rootDense = rootBuffer.subarray(0, n).fill(-1);
  let denseCount = 0;
  const mark = (t: number): number => {
    const r = staticRoot[t];
    let d = rootDense[r];
    if (d < 0) d = rootDense[r] = denseCount++;
    dense[t] = d;
    return d;
  };
  mark(ksu.gnd);
  for (const l of ksu.lines) {
    mark(l.t);
    mark(l.r);
    mark(l.a);
    mark(l.l);
  }
  for (const s of ksu.stations) {
    mark(s.t);
    mark(s.r);
  }
  for (const e of b.elements) {
    mark(e.a);
    mark(e.b);
  }
  let count = 0;
  for (const c of b.contacts) {
    const da = mark(c.a);
    const db = mark(c.b);
    if (da !== db && c.mech >= 0) count++;
  }
  const hot = {
    ca: new Int32Array(count),
    cb: new Int32Array(count),
    cond: new Int32Array(count),
    mech: new Int32Array(count),
    key: new Int32Array(count),
    count,
  };
  let k = 0;
  for (const c of b.contacts) {
    const da = dense[c.a];
    const db = dense[c.b];
    if (da === db || c.mech < 0) continue;
    hot.ca[k] = da;
    hot.cb[k] = db;
    hot.cond[k] = c.cond;
    hot.mech[k] = c.mech;
    hot.key[k++] = c.key;
  }
  for (let i = 0; i < n; i++) if (dense[i] < 0) dense[i] = rootDense[staticRoot[i]];
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
  const wireStart = wireParts(b, plan, sets, addOnParts, adapterParts);
  wireCables(b, plan);
  const edges = b.edges.concat(b.contactEdges);
  const flat = flatOf(b);
  const staticRoot = staticComponents(b.terminals.length, flat, b.edges.length);
  const { dense, denseCount, hot } = denseComponents(b, ksu, staticRoot);
  const nl = assembled({
    plan,
    parts: b.parts,
    partById: b.partById,
    sets,
    setById,
    lines: ksu.lines,
    stations: ksu.stations,
    gnd: ksu.gnd,
    terminals: b.terminals,
    edges,
    ...flat,
    contacts: b.contacts,
    elements: b.elements,
    staticRoot,
    dense,
    denseCount,
    hot,
    work: new Int32Array(denseCount),
    partTerminals: b.parts.map((_, i) => ({ names: b.names[i], pinIds: b.pinIds[i] })),
  });
  wireStarts.set(nl, wireStart);
  return nl;
}

/**
 * A netlist of its fields, with the terminal index made on first read. Made here, away from the builders: a getter
 * made inside one would keep that builder's closures (and what they hold, an earlier netlist among them) alive.
 */
function assembled(fields: Omit<Netlist, 'terminalIndex'>): Netlist {
  return {
    ...fields,
    get terminalIndex() {
      return terminalIndexOf(this);
    },
  };
}

/** Per netlist and part: where the part's wires start in edges (sets and add-ons; -1 for other parts). */
const wireStarts = new WeakMap<Netlist, Int32Array>();
/** The netlist built last, for the next edit to start from (see rewiredFrom). */
let lastBuilt: Netlist | null = null;

/** Sets or add-ons of `next` that differ from those of `prev` in their lead changes alone (null: in more). */
function leadEdits<T extends { leadChanges: LeadChange[] }>(prev: readonly T[], next: readonly T[]): number[] | null {
  if (prev.length !== next.length) return null;
  const changed: number[] = [];
  for (let i = 0; i < next.length; i++) {
    if (prev[i] === next[i]) continue;
    if (JSON.stringify(prev[i], withoutLeads) !== JSON.stringify(next[i], withoutLeads)) return null;
    changed.push(i);
  }
  return changed;
}

const withoutLeads = (key: string, value: unknown) => (key === 'leadChanges' ? undefined : value);

const sameItems = <T>(a: readonly T[], b: readonly T[]) => a.length === b.length && a.every((x, i) => x === b[i]);

/** A stretch of the earlier netlist's edges [from, to), kept as they are (leads null) or replaced by `leads`. */
interface EdgeRun {
  from: number;
  to: number;
  leads: Edge[] | null;
}

/** The parts `plan` rewires from `prev` (lead changes only), with their new lead changes, or null. */
function partsToRewire(prev: Netlist, plan: Plan): { part: number; changes: LeadChange[] }[] | null {
  const old = prev.plan;
  if (old === plan || plan.ksu !== old.ksu || !sameItems(old.adapters, plan.adapters)) return null;
  if (!sameItems(old.cables, plan.cables)) return null;
  const sets = leadEdits(old.sets, plan.sets);
  const addOns = sets && leadEdits(old.addOns, plan.addOns);
  if (!sets || !addOns) return null;
  // in part order: sets come before add-ons
  const rewire = [
    ...sets.map((i) => ({ part: prev.sets[i].part, changes: plan.sets[i].leadChanges })),
    ...addOns.map((i) => ({ part: 1 + prev.sets.length + i, changes: plan.addOns[i].leadChanges })),
  ];
  for (const { part } of rewire) {
    const p = prev.parts[part];
    if (!p.template || (p.kind !== 'set' && p.kind !== 'add-on')) return null;
  }
  return rewire;
}

/**
 * Each rewired part's lead wires made again over prev's terminals (every terminal a lead lands on is there:
 * wirePart made them all), as runs of prev's edges; `touched` gets the ends of every lead wire new or gone.
 */
function rewiredRuns(
  prev: Netlist,
  starts: Int32Array,
  rewire: { part: number; changes: LeadChange[] }[],
  touched: Uint8Array,
): { runs: EdgeRun[]; starts: Int32Array; shift: number } {
  const b = newBuilder(false);
  b.terminals = prev.terminals;
  b.names = prev.partTerminals.map((t) => t.names);
  b.pinIds = prev.partTerminals.map((t) => t.pinIds);
  const wires = prev.edges.length - prev.contacts.length;
  const runs: EdgeRun[] = [];
  const newStarts = starts.slice();
  let from = 0;
  let shift = 0;
  for (const { part, changes } of rewire) {
    const p = prev.parts[part];
    const start = starts[part];
    let end = start;
    while (end < wires && prev.edgeKind[end] === KIND_LEAD && prev.terminals[prev.edgeA[end]].part === part) end++;
    b.edges = [];
    wireLeads(b, p, p.template!, changes);
    if (b.terminals.length !== prev.terminals.length) throw new Error(`rewiring ${p.id} made a terminal`);
    // a lead wired as before is the wire object it was (what findings kept across edits look for)
    const was = new Map<string, Edge>();
    for (let k = start; k < end; k++) was.set(`${prev.edgeA[k]}|${prev.edgeB[k]}|${prev.edges[k].label}`, prev.edges[k]);
    const kept = new Set<Edge>();
    const leads = b.edges.map((e) => {
      const same = was.get(`${e.a}|${e.b}|${e.label}`);
      if (same) kept.add(same);
      else touched[e.a] = touched[e.b] = 1;
      return same ?? e;
    });
    for (let k = start; k < end; k++) if (!kept.has(prev.edges[k])) touched[prev.edgeA[k]] = touched[prev.edgeB[k]] = 1;
    runs.push({ from, to: start, leads: null }, { from: start, to: end, leads });
    const delta = leads.length - (end - start);
    for (let q = part + 1; q < newStarts.length; q++) if (starts[q] >= 0) newStarts[q] += delta;
    shift += delta;
    from = end;
  }
  runs.push({ from, to: prev.edges.length, leads: null });
  return { runs, starts: newStarts, shift };
}

/** prev's edges with the runs replaced, as objects and flat arrays, and where each of prev's edges went. */
function splicedEdges(
  prev: Netlist,
  runs: readonly EdgeRun[],
  shift: number,
): { edges: Edge[]; flat: FlatEdges; edgeIndex: Int32Array } {
  const flat = newFlat(prev.edges.length + shift);
  const edgeIndex = new Int32Array(prev.edges.length);
  const pieces: Edge[][] = [];
  let at = 0;
  for (const { from, to, leads } of runs) {
    if (leads) {
      flatInto(flat, at, leads, 0, leads.length);
      for (let k = from; k < to; k++) {
        const i = leads.indexOf(prev.edges[k]);
        edgeIndex[k] = i < 0 ? -1 : at + i;
      }
      pieces.push(leads);
      at += leads.length;
      continue;
    }
    for (let k = from; k < to; k++) edgeIndex[k] = at + k - from;
    flat.edgeA.set(prev.edgeA.subarray(from, to), at);
    flat.edgeB.set(prev.edgeB.subarray(from, to), at);
    flat.edgeKind.set(prev.edgeKind.subarray(from, to), at);
    flat.edgeContact.set(prev.edgeContact.subarray(from, to), at);
    pieces.push(prev.edges.slice(from, to));
    at += to - from;
  }
  return { edges: ([] as Edge[]).concat(...pieces), flat, edgeIndex };
}

/**
 * staticComponents after a rewiring, solving again only the static nets with a touched terminal: the others keep
 * their wires, and so their roots. A net's root depends only on the unions of its own wires, in edge order, so
 * this gives staticComponents' roots exactly. New wires have touched ends, so they join only such nets.
 */
function restaticed(prev: Netlist, flat: FlatEdges, wires: number, touched: Uint8Array): Int32Array {
  const n = prev.terminals.length;
  const was = prev.staticRoot;
  const root = was.slice();
  const redo = new Uint8Array(n);
  let any = false;
  for (let t = 0; t < n; t++) {
    if (!touched[t]) continue;
    redo[was[t]] = 1;
    any = true;
  }
  if (!any) return root;
  for (let t = 0; t < n; t++) if (redo[was[t]]) root[t] = t;
  const { edgeA, edgeB } = flat;
  for (let k = 0; k < wires; k++) {
    if (!redo[was[edgeA[k]]]) continue;
    const ra = findRoot(root, edgeA[k]);
    const rb = findRoot(root, edgeB[k]);
    if (ra !== rb) root[ra] = rb;
  }
  for (let t = 0; t < n; t++) if (redo[was[t]]) root[t] = findRoot(root, t);
  return root;
}

/**
 * The netlist of a plan that differs from `prev`'s only in some sets' or add-ons' lead changes (what a lead edit
 * on the Bench and every cure candidate make), or null for any other edit. Such a plan has every part, terminal,
 * contact and load of `prev`, and every wire but those parts' leads: their lead wires (the first wires of each
 * part, see wirePart) are made again and spliced in, the other wires are `prev`'s own objects, and the static
 * nets are solved again. The result equals buildNetlist's (tests/engine/netlist-cache.test.ts).
 */
function rewiredFrom(prev: Netlist, plan: Plan): Netlist | null {
  const starts = wireStarts.get(prev);
  const rewire = starts && partsToRewire(prev, plan);
  if (!starts || !rewire) return null;
  const touched = new Uint8Array(prev.terminals.length);
  const { runs, starts: newStarts, shift } = rewiredRuns(prev, starts, rewire, touched);
  const { edges, flat, edgeIndex } = splicedEdges(prev, runs, shift);
  const staticRoot = restaticed(prev, flat, prev.edges.length - prev.contacts.length + shift, touched);
  const { dense, denseCount, hot } = denseComponents(prev, prev, staticRoot);
  const nl = assembled({
    plan,
    parts: prev.parts,
    partById: prev.partById,
    sets: prev.sets,
    setById: prev.setById,
    lines: prev.lines,
    stations: prev.stations,
    gnd: prev.gnd,
    terminals: prev.terminals,
    edges,
    ...flat,
    contacts: prev.contacts,
    elements: prev.elements,
    staticRoot,
    dense,
    denseCount,
    hot,
    work: new Int32Array(denseCount),
    partTerminals: prev.partTerminals,
  });
  wireStarts.set(nl, newStarts);
  // one step back only: prev lets go of the netlist before it, so a run of edits keeps two netlists, not all
  const before = rewirings.get(prev);
  if (before) before.prev = null;
  rewirings.set(nl, { prev, touched, edgeIndex });
  return nl;
}

/**
 * How a netlist was made from the one before it by rewiring some parts' leads (rewiredFrom): for what is kept
 * across an edit (paths.ts trees, the wiring rule's paths). Every terminal, contact and load is as it was; a wire
 * is as it was, at edgeIndex's place, unless one of its ends is `touched`. So whatever was read off the earlier
 * netlist over untouched terminals only is the same on this one, wire indices mapped.
 */
export interface Rewiring {
  /** The earlier netlist, until a netlist is rewired from this one. */
  prev: Netlist | null;
  /** Per terminal: 1 when it is an end of a lead wire the edit added or took away. */
  touched: Uint8Array;
  /** The earlier netlist's wire index → this one's (-1: gone). */
  edgeIndex: Int32Array;
}

const rewirings = new WeakMap<Netlist, Rewiring>();

/** How `nl` was rewired from the netlist before it, when it was. */
export function rewiringOf(nl: Netlist): Rewiring | undefined {
  return rewirings.get(nl);
}
