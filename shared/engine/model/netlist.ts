/**
 * The model layer: a plan turned into terminals, wires, loads (elements) and contacts.
 * Built once per plan object (cached in a WeakMap); lead changes and the KSU cross-connect are applied here.
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

export function getNetlist(plan: Plan): Netlist {
  let nl = cache.get(plan);
  if (!nl) {
    nl = buildNetlist(plan);
    cache.set(plan, nl);
  }
  return nl;
}

export function buildNetlist(plan: Plan): Netlist {
  const parts: PartInfo[] = [];
  const partById = new Map<string, PartInfo>();
  const addPart = (
    id: string,
    name: string,
    kind: PartKind,
    template: PartTemplate | undefined,
  ): PartInfo => {
    const p: PartInfo = { index: parts.length, id, name, kind, template, setIndex: -1, servesSet: -1 };
    parts.push(p);
    if (!partById.has(id)) partById.set(id, p);
    return p;
  };

  const terminals: TerminalInfo[] = [];
  const terminalIndex = new Map<string, number>();
  const term = (part: number, name: string): number => {
    const key = `${part}|${name}`;
    let id = terminalIndex.get(key);
    if (id === undefined) {
      id = terminals.length;
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
      terminals.push(info);
      terminalIndex.set(key, id);
    }
    return id;
  };
  // Connector pins are asked for often (every cable, bridge and lead): their ids are kept per part and port.
  const pinIds: (Map<string, Int32Array> | undefined)[] = [];
  const pinTerm = (part: number, port: string, pin: number): number => {
    if (!(pin >= 1 && pin <= PIN_COUNT)) return term(part, `${port}:${pin}`);
    const byPort = (pinIds[part] ??= new Map());
    let ids = byPort.get(port);
    if (!ids) {
      ids = new Int32Array(PIN_COUNT + 1).fill(-1);
      byPort.set(port, ids);
    }
    if (ids[pin] < 0) ids[pin] = term(part, `${port}:${pin}`);
    return ids[pin];
  };

  const edges: Edge[] = [];
  const contactEdges: Edge[] = [];
  const contacts: ContactInfo[] = [];
  const elements: ElementInfo[] = [];

  // KSU
  const ksuPart = addPart(plan.ksu.id, plan.ksu.name, 'ksu', getTemplate('ksu'));
  const gnd = term(ksuPart.index, 'GND');
  const lines: LineInfo[] = plan.ksu.lines.map((l) => ({
    number: l.number,
    directoryNumber: l.directoryNumber,
    t: term(ksuPart.index, `L${l.number}.T`),
    r: term(ksuPart.index, `L${l.number}.R`),
    a: term(ksuPart.index, `L${l.number}.A`),
    l: term(ksuPart.index, `L${l.number}.L`),
  }));
  const lineByNumber = new Map(lines.map((l) => [l.number, l]));
  const stations: StationInfo[] = plan.ksu.stations.map((s) => ({
    id: s.id,
    code: s.code,
    t: term(ksuPart.index, `BZ.${s.id}.T`),
    r: term(ksuPart.index, `BZ.${s.id}.R`),
  }));
  const stationById = new Map(stations.map((s) => [s.id, s]));
  for (const cc of effectiveCrossConnect(plan.ksu)) {
    if (cc.port > plan.ksu.ports) continue;
    const port = ksuPortName(cc.port);
    const tipPin = pinTerm(ksuPart.index, port, pinOf(cc.pair, 'tip'));
    const ringPin = pinTerm(ksuPart.index, port, pinOf(cc.pair, 'ring'));
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
    edges.push({ a: tipPin, b: tipTo, kind: 'cross-connect', label: `cross-connect: ${what} (tip)` });
    edges.push({ a: ringPin, b: ringTo, kind: 'cross-connect', label: `cross-connect: ${what} (ring)` });
  }

  // Sets first, so add-ons can find the set they serve.
  const sets: SetInfo[] = [];
  for (const s of plan.sets) {
    const tpl = getTemplate(s.template);
    const p = addPart(s.id, s.name, 'set', tpl?.kind === 'set' ? tpl : undefined);
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
  const setById = new Map(sets.map((s) => [s.id, s]));
  const addOnParts = plan.addOns.map((a) => {
    const tpl = getTemplate(a.template);
    const p = addPart(a.id, a.name, 'add-on', tpl?.kind === 'add-on' ? tpl : undefined);
    const served = setById.get(a.serves);
    if (served) {
      p.servesSet = served.index;
      served.addOns.push(p.index);
    }
    return p;
  });
  const adapterParts = plan.adapters.map((a) => {
    const tpl = getTemplate(a.template);
    return addPart(a.id, a.name, 'adapter', tpl?.kind === 'adapter' ? tpl : undefined);
  });

  const wireTemplate = (
    p: PartInfo,
    changes: readonly LeadChange[],
    ownerSet: number,
    bridgedPairs?: number[],
  ) => {
    const tpl = p.template;
    if (!tpl) return;
    if (tpl.leadPort) {
      const at = applyLeadChanges(tpl.leads, changes);
      tpl.leads.forEach((lead, i) => {
        const t = term(p.index, lead.terminal);
        terminals[t].lead ??= lead;
        const pair = at[i];
        if (pair === null) return;
        const pin = pinTerm(p.index, tpl.leadPort!, pinOf(pair, lead.conductor));
        const moved = pair !== lead.pair ? ` (moved to pair ${pair}, ${pairColour(pair).name})` : '';
        edges.push({ a: t, b: pin, kind: 'lead', label: `lead ${lead.designation}${moved}`, lead });
      });
    }
    for (const group of tpl.bridges ?? []) {
      const pairs = bridgedPairs ?? Array.from({ length: 25 }, (_, i) => i + 1);
      for (const pair of pairs) {
        for (const conductor of ['tip', 'ring'] as const) {
          const pin = pinOf(pair, conductor);
          const first = pinTerm(p.index, group[0], pin);
          for (let g = 1; g < group.length; g++) {
            edges.push({
              a: first,
              b: pinTerm(p.index, group[g], pin),
              kind: 'bridge',
              label: `bridged inside ${p.name}`,
            });
          }
        }
      }
    }
    for (const c of tpl.contacts) {
      const a = term(p.index, c.a);
      const b = term(p.index, c.b);
      const when = c.when;
      const cond =
        typeof when === 'object'
          ? COND_KEY
          : when === 'offHook'
            ? COND_OFF_HOOK
            : when === 'notHoldPressed'
              ? COND_NOT_HOLD
              : COND_HANDS_FREE;
      const index = contacts.length;
      contacts.push({
        a,
        b,
        cond,
        mech: ownerSet,
        key: typeof when === 'object' ? when.key : 0,
        part: p.index,
        label: c.label,
      });
      contactEdges.push({ a, b, kind: 'contact', label: c.label, contact: index });
    }
    for (const e of tpl.elements) {
      elements.push({
        kind: e.kind,
        a: term(p.index, e.a),
        b: term(p.index, e.b),
        part: p.index,
        owner: ownerSet,
        key: e.key,
        label: e.label,
      });
    }
  };

  plan.sets.forEach((s, i) => {
    const info = sets[i];
    const p = parts[info.part];
    wireTemplate(p, s.leadChanges, info.index);
    for (const line of s.ringerLines) {
      const strap = p.template?.ringerStraps?.find((r) => r.line === line);
      if (!strap) continue;
      elements.push({
        kind: 'ringer',
        a: term(p.index, strap.tip),
        b: term(p.index, strap.ring),
        part: p.index,
        owner: info.index,
        line,
        label: `Ringer strapped to line ${line}`,
      });
    }
  });
  plan.addOns.forEach((a, i) => wireTemplate(addOnParts[i], a.leadChanges, addOnParts[i].servesSet));
  plan.adapters.forEach((a, i) => wireTemplate(adapterParts[i], [], -1, a.bridgedPairs));

  // Cables: pin for pin.
  const portExists = (part: PartInfo, port: string): boolean => {
    if (part.kind === 'ksu') {
      const m = /^port-(\d+)$/.exec(port);
      return !!m && Number(m[1]) >= 1 && Number(m[1]) <= plan.ksu.ports;
    }
    return !!part.template?.ports.some((pt) => pt.name === port);
  };
  for (const c of plan.cables) {
    const from = partById.get(c.from.part);
    const to = partById.get(c.to.part);
    if (!from || !to || !portExists(from, c.from.port) || !portExists(to, c.to.port)) continue;
    // Pin for pin, with the cable's wiring faults (split, reversed, open) applied: see cable-faults.ts.
    for (const w of cableWires(c)) {
      edges.push({
        a: pinTerm(from.index, c.from.port, w.fromPin),
        b: pinTerm(to.index, c.to.port, w.toPin),
        kind: 'cable',
        label: `cable ${c.label || c.id}${w.note}`,
        cable: c.id,
      });
    }
  }

  // Static connectivity over wires only.
  const n = terminals.length;
  const parent = new Int32Array(n);
  for (let i = 0; i < n; i++) parent[i] = i;
  for (const e of edges) {
    const ra = find(parent, e.a);
    const rb = find(parent, e.b);
    if (ra !== rb) parent[ra] = rb;
  }
  const staticRoot = new Int32Array(n);
  for (let i = 0; i < n; i++) staticRoot[i] = find(parent, i);

  // Dense ids for the components the state can change or the observations read.
  const dense = new Int32Array(n).fill(-1);
  const rootDense = new Map<number, number>();
  const mark = (t: number): number => {
    const r = staticRoot[t];
    let d = rootDense.get(r);
    if (d === undefined) {
      d = rootDense.size;
      rootDense.set(r, d);
    }
    dense[t] = d;
    return d;
  };
  mark(gnd);
  for (const l of lines) [l.t, l.r, l.a, l.l].forEach(mark);
  for (const s of stations) [s.t, s.r].forEach(mark);
  for (const e of elements) [e.a, e.b].forEach(mark);
  const hotList: ContactInfo[] = [];
  for (const c of contacts) {
    const da = mark(c.a);
    const db = mark(c.b);
    if (da !== db && c.mech >= 0) hotList.push(c);
  }
  for (let i = 0; i < n; i++)
    if (dense[i] < 0 && rootDense.has(staticRoot[i])) dense[i] = rootDense.get(staticRoot[i])!;
  const count = hotList.length;
  const hot = {
    ca: Int32Array.from(hotList, (c) => dense[c.a]),
    cb: Int32Array.from(hotList, (c) => dense[c.b]),
    cond: Int32Array.from(hotList, (c) => c.cond),
    mech: Int32Array.from(hotList, (c) => c.mech),
    key: Int32Array.from(hotList, (c) => c.key),
    count,
  };

  return {
    plan,
    parts,
    partById,
    sets,
    setById,
    lines,
    stations,
    gnd,
    terminals,
    edges: edges.concat(contactEdges),
    contacts,
    elements,
    staticRoot,
    dense,
    denseCount: rootDense.size,
    hot,
    work: new Int32Array(rootDense.size),
    terminalIndex,
  };
}
