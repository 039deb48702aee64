/** Conductor paths: breadth-first search over wires and (optionally) the contacts closed in one state. */
import { pairColour } from '../document/cable-code';
import { perNetlist, rewiringOf, type Edge, type Netlist, type PartInfo, type TerminalInfo } from '../model/netlist';
import { contactClosed, type Mech } from '../model/nets';
import type { LeadSpec } from '../templates/template.types';
import type { Hop } from './evaluation.types';

interface Adjacency {
  offset: Int32Array;
  to: Int32Array;
  edge: Int32Array;
  /** Per adjacency slot: the contact the edge is (index into netlist.contacts), or -1 for a wire. */
  contact: Int32Array;
  /** Per contact: condition, owning set and key (as in ContactInfo), for the closed test without objects. */
  cond: Int32Array;
  mech: Int32Array;
  key: Int32Array;
}

const adjacency = perNetlist((nl): Adjacency => {
  const n = nl.terminals.length;
  const { edgeA, edgeB, edgeContact } = nl;
  const m = edgeA.length;
  const offset = new Int32Array(n + 1);
  for (let i = 0; i < m; i++) {
    offset[edgeA[i] + 1]++;
    offset[edgeB[i] + 1]++;
  }
  for (let i = 0; i < n; i++) offset[i + 1] += offset[i];
  const fill = offset.slice(0, n);
  const to = new Int32Array(m * 2);
  const edge = new Int32Array(m * 2);
  const contact = new Int32Array(m * 2);
  for (let i = 0; i < m; i++) {
    const a = edgeA[i];
    const b = edgeB[i];
    const c = edgeContact[i];
    let k = fill[a]++;
    to[k] = b;
    contact[k] = c;
    edge[k] = i;
    k = fill[b]++;
    to[k] = a;
    contact[k] = c;
    edge[k] = i;
  }
  const nc = nl.contacts.length;
  const cond = new Int32Array(nc);
  const mech = new Int32Array(nc);
  const key = new Int32Array(nc);
  for (let i = 0; i < nc; i++) {
    const c = nl.contacts[i];
    cond[i] = c.cond;
    mech[i] = c.mech;
    key[i] = c.key;
  }
  return { offset, to, edge, contact, cond, mech, key };
});

/**
 * Scratch arrays for a PathFinder, one entry per terminal. The breadth-first trees of one finder never share a
 * terminal (each stays inside its own net), so they share prev / prevEdge; a finder hands them back cleared
 * (release), and the next finder takes them instead of allocating, on this netlist or any other no larger (an edit
 * makes a new netlist of about the same size).
 */
interface Scratch {
  prev: Int32Array;
  prevEdge: Int32Array;
  mark: Int32Array;
  position: Int32Array;
  stamp: number;
}

const scratchPool: Scratch[] = [];
/** Enough for the finders alive at once (one per evaluation in progress, and findPath). */
const SCRATCH_POOL_MAX = 4;

function takeScratch(nl: Netlist): Scratch {
  const n = nl.terminals.length;
  for (let i = scratchPool.length - 1; i >= 0; i--) {
    if (scratchPool[i].prev.length < n) continue;
    const [sc] = scratchPool.splice(i, 1);
    return sc;
  }
  return {
    prev: new Int32Array(n).fill(-1),
    prevEdge: new Int32Array(n).fill(-1),
    mark: new Int32Array(n),
    position: new Int32Array(n),
    stamp: 0,
  };
}

/** Scratch handed back cleared (prev and prevEdge all -1), for the next finder or path. */
function giveBack(sc: Scratch): void {
  if (scratchPool.length >= SCRATCH_POOL_MAX) scratchPool.shift();
  scratchPool.push(sc);
}

export interface TerminalPath {
  terms: number[];
  /** edges[i] joins terms[i] and terms[i + 1]. */
  edges: number[];
}

/**
 * The terminal and wire objects a path runs over. A netlist rewired from another keeps the objects of every part
 * and cable the edit left alone (model/netlist.ts), so a kept path means the same on it when it runs over the same
 * objects (runsOver).
 */
export interface PathObjects {
  terminals: readonly TerminalInfo[];
  wires: readonly Edge[];
}

export function pathObjects(nl: Netlist, p: TerminalPath): PathObjects {
  return { terminals: p.terms.map((t) => nl.terminals[t]), wires: p.edges.map((e) => nl.edges[e]) };
}

/** Whether `p` on `nl` runs over exactly the terminal and wire objects `kept` (from pathObjects). */
export function runsOver(nl: Netlist, p: TerminalPath, kept: PathObjects): boolean {
  const { terminals, wires } = kept;
  if (terminals.length !== p.terms.length || wires.length !== p.edges.length) return false;
  for (let i = 0; i < terminals.length; i++) if (nl.terminals[p.terms[i]] !== terminals[i]) return false;
  for (let i = 0; i < wires.length; i++) if (nl.edges[p.edges[i]] !== wires[i]) return false;
  return true;
}

/** Shortest conductor path between two terminals; mech null = wires only (no contacts). */
export function findPath(nl: Netlist, from: number, to: number, mech: Mech | null): TerminalPath | null {
  const adj = adjacency(nl);
  // pooled scratch (cleared again below): a netlist's wiring findings trace many of these
  const sc = takeScratch(nl);
  const { prev, prevEdge } = sc;
  prev[from] = from;
  const queue = [from];
  for (let q = 0; q < queue.length; q++) {
    const t = queue[q];
    if (t === to) break;
    for (let k = adj.offset[t]; k < adj.offset[t + 1]; k++) {
      const next = adj.to[k];
      if (prev[next] !== -1) continue;
      const c = adj.contact[k];
      if (c >= 0 && (!mech || !contactClosed(adj.cond[c], adj.mech[c], adj.key[c], mech))) continue;
      prev[next] = t;
      prevEdge[next] = adj.edge[k];
      queue.push(next);
    }
  }
  let found: TerminalPath | null = null;
  if (prev[to] !== -1) {
    const terms = [to];
    const edges: number[] = [];
    for (let t = to; t !== from; t = prev[t]) {
      edges.push(prevEdge[t]);
      terms.push(prev[t]);
    }
    found = { terms: terms.reverse(), edges: edges.reverse() };
  }
  for (let i = 0; i < queue.length; i++) prev[queue[i]] = prevEdge[queue[i]] = -1;
  giveBack(sc);
  return found;
}

/**
 * A whole breadth-first tree of one net, kept between evaluations of the netlist. It is the same tree in any state
 * where each contact next to one of its terminals is as it was (open or closed): wires never change, so the search
 * then visits the same terminals in the same order. Paths read off it are kept with it.
 */
interface Tree {
  root: number;
  /** Terminals in breadth-first order, and for each its parent terminal and the edge from it. */
  queue: Int32Array;
  prev: Int32Array;
  prevEdge: Int32Array;
  /** Every contact next to a terminal of the tree (once each), and whether it was closed. */
  contacts: Int32Array;
  closed: Uint8Array;
  /**
   * The sets owning those contacts and their positions when it grew (offHook, pressedKey, holdDown, handsFreeOn
   * per set), or null when it grew with no contacts closed (mech null): while they are unchanged it still holds.
   */
  owners: Int32Array | null;
  positions: Int32Array | null;
  /** Keyed by from × terminal count + to. */
  paths: Map<number, TerminalPath | null>;
}

/** Trees kept per netlist and root terminal, most recent last. */
const treeCache = new WeakMap<Netlist, Map<number, Tree[]>>();
/** Trees kept per root: a few states' worth (a net keeps its tree while the sets on it stay as they are). */
const TREES_PER_ROOT = 4;
/** Roots kept per netlist (least recently used go first). */
const ROOTS_MAX = 256;

/**
 * The trees of the netlist an edit was made on that still hold after it: those over terminals the edit left as
 * they were (Rewiring), their wire indices mapped. Their paths are walked again (a path names wires by index).
 */
function carriedTrees(nl: Netlist): Map<number, Tree[]> {
  const carried = new Map<number, Tree[]>();
  const rewiring = rewiringOf(nl);
  const before = rewiring?.prev;
  const kept = before && treeCache.get(before);
  if (!rewiring || !kept) return carried;
  const { touched, edgeIndex } = rewiring;
  for (const [root, trees] of kept) {
    const list: Tree[] = [];
    for (const tree of trees) {
      const { queue } = tree;
      let clear = true;
      for (let k = 0; k < queue.length && clear; k++) clear = touched[queue[k]] === 0;
      if (!clear) continue;
      const prevEdge = tree.prevEdge.map((e) => (e < 0 ? e : edgeIndex[e]));
      list.push({ ...tree, prevEdge, paths: new Map() });
    }
    if (list.length) carried.set(root, list);
  }
  return carried;
}

let growQueue = new Int32Array(0);
const grownContacts: number[] = [];
/** Per contact: the last grow that listed it (stamps, so that a tree lists each contact once). */
let contactSeen = new Int32Array(0);
let growStamp = 0;
/** Per set: the last grow that listed it among a tree's owners. */
let ownerSeen = new Int32Array(0);

/**
 * Paths in one state from a few sources to many targets: one breadth-first tree per net, rooted at the first
 * terminal asked for in it (findings of one evaluation start from a handful of KSU terminals), taken from an
 * earlier evaluation when it still holds (see Tree).
 */
export class PathFinder {
  private readonly trees = new Map<number, Tree>();
  /** Trees whose parents are in the scratch arrays (only those a new path is walked on). */
  private readonly loaded: Tree[] = [];
  /** Keyed by from × terminal count + to. */
  private readonly paths = new Map<number, TerminalPath | null>();
  private scratch: Scratch | null = null;
  private readonly adj: Adjacency;

  /**
   * roots: the state's dense-component roots (from computeFacts), to tell which net a terminal is on; null with
   * mech null: wires only, nets are the static components.
   */
  constructor(
    private readonly nl: Netlist,
    private readonly mech: Mech | null,
    private readonly roots: Int32Array | null,
  ) {
    this.adj = adjacency(nl);
  }

  path(from: number, to: number): TerminalPath | null {
    const key = from * this.nl.terminals.length + to;
    const known = this.paths.get(key);
    if (known !== undefined) return known;
    const found = this.trace(from, to, key);
    this.paths.set(key, found);
    return found;
  }

  /**
   * Hands the scratch arrays back for the next finder. Paths and hops already returned stay valid; the finder
   * must not be asked for new paths afterwards.
   */
  release(): void {
    const sc = this.scratch;
    if (!sc) return;
    this.scratch = null;
    const { prev, prevEdge } = sc;
    for (const tree of this.loaded) {
      const { queue } = tree;
      for (let i = 0; i < queue.length; i++) {
        prev[queue[i]] = -1;
        prevEdge[queue[i]] = -1;
      }
    }
    this.loaded.length = 0;
    this.trees.clear();
    giveBack(sc);
  }

  /** The path between two terminals of one net: up the net's tree from one to their lowest common ancestor and down. */
  private trace(from: number, to: number, key: number): TerminalPath | null {
    const net = this.netOf(from);
    if (net !== this.netOf(to)) return null;
    let tree = this.trees.get(net);
    if (!tree) {
      tree = this.treeFrom(from);
      this.trees.set(net, tree);
    }
    const known = tree.paths.get(key);
    if (known !== undefined) return known;
    const sc = (this.scratch ??= takeScratch(this.nl));
    const { prev, prevEdge } = sc;
    if (!this.loaded.includes(tree)) {
      // into the scratch arrays, for the walks up the tree
      this.loaded.push(tree);
      const { queue } = tree;
      for (let k = 0; k < queue.length; k++) {
        prev[queue[k]] = tree.prev[k];
        prevEdge[queue[k]] = tree.prevEdge[k];
      }
    }
    let found: TerminalPath | null = null;
    if (prev[from] !== -1 && prev[to] !== -1) found = this.walk(sc, from, to);
    tree.paths.set(key, found);
    return found;
  }

  private walk(sc: Scratch, from: number, to: number): TerminalPath {
    const { prev, prevEdge, mark, position } = sc;
    const upFrom: number[] = [from];
    for (let t = from; prev[t] !== t; t = prev[t]) upFrom.push(prev[t]);
    const stamp = ++sc.stamp;
    for (let i = 0; i < upFrom.length; i++) {
      mark[upFrom[i]] = stamp;
      position[upFrom[i]] = i;
    }
    const upTo: number[] = [to];
    for (let t = to; mark[t] !== stamp; t = prev[t]) upTo.push(prev[t]);
    const meet = position[upTo[upTo.length - 1]];
    const terms = upFrom.slice(0, meet + 1);
    const edges: number[] = [];
    for (let i = 0; i < meet; i++) edges.push(prevEdge[upFrom[i]]);
    for (let i = upTo.length - 2; i >= 0; i--) {
      terms.push(upTo[i]);
      edges.push(prevEdge[upTo[i]]);
    }
    return { terms, edges };
  }

  private netOf(t: number): number {
    return this.roots
      ? this.nl.dense[t] < 0
        ? -1 - t
        : this.roots[this.nl.dense[t]]
      : this.nl.staticRoot[t];
  }

  /** Hops of a path this finder returned; findings that share a path share one list. */
  hopsOf(path: TerminalPath): Hop[] {
    return hopsOfPath(this.nl, path);
  }

  /** The tree rooted at `root` in this state: a kept one that still holds, else grown now and kept. */
  private treeFrom(root: number): Tree {
    let byRoot = treeCache.get(this.nl);
    if (!byRoot) treeCache.set(this.nl, (byRoot = carriedTrees(this.nl)));
    const kept = byRoot.get(root);
    if (kept) {
      byRoot.delete(root);
      byRoot.set(root, kept);
      for (let i = kept.length - 1; i >= 0; i--) if (this.holds(kept[i])) return kept[i];
    }
    const tree = this.grow(root);
    const list = kept ?? [];
    if (list.length >= TREES_PER_ROOT) list.shift();
    list.push(tree);
    if (!kept) {
      if (byRoot.size >= ROOTS_MAX) byRoot.delete(byRoot.keys().next().value!);
      byRoot.set(root, list);
    }
    return tree;
  }

  private closed(c: number): boolean {
    const { cond, mech: owner, key } = this.adj;
    return this.mech !== null && contactClosed(cond[c], owner[c], key[c], this.mech);
  }

  private holds(tree: Tree): boolean {
    const { owners, positions } = tree;
    const m = this.mech;
    if (m !== null && owners !== null && positions !== null) {
      // the sets next to the tree are where they were: every contact is as it was
      let same = true;
      for (let k = 0, at = 0; k < owners.length && same; k++, at += 4) {
        const o = owners[k];
        same =
          m.offHook[o] === positions[at] &&
          m.pressedKey[o] === positions[at + 1] &&
          m.holdDown[o] === positions[at + 2] &&
          m.handsFreeOn[o] === positions[at + 3];
      }
      if (same) return true;
    }
    const { contacts, closed } = tree;
    for (let k = 0; k < contacts.length; k++)
      if (this.closed(contacts[k]) !== (closed[k] === 1)) return false;
    return true;
  }

  /** Breadth-first over wires and the contacts closed in this state, the whole net (the scratch is left clear). */
  private grow(root: number): Tree {
    const { offset, to, edge, contact } = this.adj;
    const sc = (this.scratch ??= takeScratch(this.nl));
    const { prev, prevEdge } = sc;
    if (growQueue.length < this.nl.terminals.length) growQueue = new Int32Array(this.nl.terminals.length);
    const queue = growQueue;
    const contacts = grownContacts;
    contacts.length = 0;
    if (contactSeen.length < this.nl.contacts.length) contactSeen = new Int32Array(this.nl.contacts.length);
    const seen = contactSeen;
    const stamp = ++growStamp;
    let tail = 0;
    queue[tail++] = root;
    prev[root] = root;
    for (let head = 0; head < tail; head++) {
      const t = queue[head];
      const end = offset[t + 1];
      for (let k = offset[t]; k < end; k++) {
        const c = contact[k];
        if (c >= 0) {
          if (seen[c] !== stamp) {
            seen[c] = stamp;
            contacts.push(c);
          }
          if (!this.closed(c)) continue;
        }
        const next = to[k];
        if (prev[next] !== -1) continue;
        prev[next] = t;
        prevEdge[next] = edge[k];
        queue[tail++] = next;
      }
    }
    const tree: Tree = {
      root,
      queue: queue.slice(0, tail),
      prev: new Int32Array(tail),
      prevEdge: new Int32Array(tail),
      contacts: Int32Array.from(contacts),
      closed: new Uint8Array(contacts.length),
      owners: null,
      positions: null,
      paths: new Map(),
    };
    for (let k = 0; k < tail; k++) {
      const t = queue[k];
      tree.prev[k] = prev[t];
      tree.prevEdge[k] = prevEdge[t];
      prev[t] = -1;
      prevEdge[t] = -1;
    }
    for (let k = 0; k < contacts.length; k++) tree.closed[k] = this.closed(contacts[k]) ? 1 : 0;
    const m = this.mech;
    if (m !== null) {
      if (ownerSeen.length < this.nl.sets.length) ownerSeen = new Int32Array(this.nl.sets.length);
      const owners: number[] = [];
      for (let k = 0; k < contacts.length; k++) {
        const o = this.adj.mech[contacts[k]];
        if (o < 0 || ownerSeen[o] === stamp) continue;
        ownerSeen[o] = stamp;
        owners.push(o);
      }
      tree.owners = Int32Array.from(owners);
      tree.positions = new Int32Array(4 * owners.length);
      owners.forEach((o, k) => {
        tree.positions![4 * k] = m.offHook[o];
        tree.positions![4 * k + 1] = m.pressedKey[o];
        tree.positions![4 * k + 2] = m.holdDown[o];
        tree.positions![4 * k + 3] = m.handsFreeOn[o];
      });
    }
    return tree;
  }
}

const hopsByPath = new WeakMap<TerminalPath, Hop[]>();

/** Hops of a path (a path belongs to one netlist); findings that share a path share one list. */
function hopsOfPath(nl: Netlist, path: TerminalPath): Hop[] {
  let hops = hopsByPath.get(path);
  if (!hops) hopsByPath.set(path, (hops = toHops(nl, path)));
  return hops;
}

const KSU_LEAD_NAMES: Record<string, string> = { T: 'tip', R: 'ring', A: 'A-lead', L: 'lamp lead' };

function portLabel(part: PartInfo, port: string): string {
  if (part.kind === 'ksu') return `station port ${port.replace(/^port-/, '')}`;
  return part.template?.ports.find((p) => p.name === port)?.label.toLowerCase() ?? port;
}

const textCache = new WeakMap<Netlist, (string | undefined)[]>();
/**
 * Across netlists, by terminal object: a part wired as before (a cached wiring, model/netlist.ts) brings the same
 * terminal objects, of a part with the same name, template and (for the KSU) stations, so the same text.
 */
const textByTerminal = new WeakMap<TerminalInfo, string>();

export function terminalText(nl: Netlist, term: number): string {
  let texts = textCache.get(nl);
  if (!texts) {
    texts = [];
    textCache.set(nl, texts);
  }
  let text = texts[term];
  if (text === undefined) {
    const t = nl.terminals[term];
    text = textByTerminal.get(t);
    if (text === undefined) textByTerminal.set(t, (text = describeTerminal(nl, term)));
    texts[term] = text;
  }
  return text;
}

function describeTerminal(nl: Netlist, term: number): string {
  const t = nl.terminals[term];
  const part = nl.parts[t.part];
  if (t.pin !== undefined && t.pair !== undefined) {
    return `${part.name}, ${portLabel(part, t.port!)} pin ${t.pin} (pair ${t.pair} ${t.conductor}, ${pairColour(t.pair).name})`;
  }
  if (part.kind === 'ksu') {
    const m = /^L(\d+)\.([TRAL])$/.exec(t.name);
    if (m) return `${part.name}, line ${m[1]} ${KSU_LEAD_NAMES[m[2]]}`;
    if (t.name === 'GND') return `${part.name}, ground (A1 / LG)`;
    const st = nl.stations.find((s) => s.t === term || s.r === term);
    if (st) return `${part.name}, intercom buzzer output for station ${st.code}`;
  }
  const d = t.lead?.designation;
  return `${part.name}, terminal ${t.name}${d && d !== t.name ? ` (${d})` : ''}`;
}

const hopCache = new WeakMap<Netlist, (Map<number, Hop> | undefined)[]>();

/**
 * Across netlists, by the objects a hop is made of: the terminal and the wires before and after it (objects a
 * cached wiring shares between netlists only where ids, labels and parts are as before). NO_EDGE stands for none.
 */
const NO_EDGE = {} as Edge;
const hopByObjects = new WeakMap<TerminalInfo, WeakMap<Edge, WeakMap<Edge, Hop>>>();

function sharedHop(nl: Netlist, path: TerminalPath, i: number): Hop {
  const t = nl.terminals[path.terms[i]];
  const via = i > 0 ? nl.edges[path.edges[i - 1]] : NO_EDGE;
  const next = i < path.edges.length ? nl.edges[path.edges[i]] : NO_EDGE;
  let byVia = hopByObjects.get(t);
  if (!byVia) hopByObjects.set(t, (byVia = new WeakMap()));
  let byNext = byVia.get(via);
  if (!byNext) byVia.set(via, (byNext = new WeakMap()));
  let hop = byNext.get(next);
  if (!hop) byNext.set(next, (hop = makeHop(nl, path, i)));
  return hop;
}

/** Hops depend only on the terminal and the wire or contact that reached it, so they are made once per netlist. */
export function toHops(nl: Netlist, path: TerminalPath): Hop[] {
  let cache = hopCache.get(nl);
  if (!cache) {
    cache = new Array<Map<number, Hop> | undefined>(nl.terminals.length);
    hopCache.set(nl, cache);
  }
  const stride = nl.edges.length + 1;
  const hops: Hop[] = new Array(path.terms.length);
  for (let i = 0; i < path.terms.length; i++) {
    const via = i > 0 ? path.edges[i - 1] : -1;
    const next = i < path.edges.length ? path.edges[i] : -1;
    // The hop of a part terminal also names the pair of an adjacent lead, so the next edge is part of the key.
    const term = path.terms[i];
    const key = (via + 1) * stride + next + 1;
    const byEdges = (cache[term] ??= new Map());
    let hop = byEdges.get(key);
    if (!hop) {
      hop = sharedHop(nl, path, i);
      byEdges.set(key, hop);
    }
    hops[i] = hop;
  }
  return hops;
}

function makeHop(nl: Netlist, path: TerminalPath, i: number): Hop {
  const term = path.terms[i];
  const t = nl.terminals[term];
  const part = nl.parts[t.part];
  const via = i > 0 ? nl.edges[path.edges[i - 1]] : undefined;
  const hop: Hop = { part: part.id, partName: part.name, text: terminalText(nl, term) };
  if (t.pin !== undefined) {
    hop.pin = t.pin;
    hop.port = t.port;
    hop.pair = t.pair;
    hop.conductor = t.conductor;
    hop.colour = pairColour(t.pair!).name;
  } else {
    hop.terminal = t.name;
    if (t.lead) hop.designation = t.lead.designation;
    // A part terminal entered or left by a lead: name the cord pair that lead is on.
    const next = i < path.edges.length ? nl.edges[path.edges[i]] : undefined;
    const leadEdge = via?.kind === 'lead' ? via : next?.kind === 'lead' ? next : undefined;
    if (leadEdge) {
      const pin = nl.terminals[leadEdge === via ? path.terms[i - 1] : path.terms[i + 1]];
      if (pin.pair !== undefined) {
        hop.pair = pin.pair;
        hop.conductor = pin.conductor;
        hop.colour = pairColour(pin.pair).name;
        hop.designation = leadEdge.lead?.designation ?? hop.designation;
      }
    }
  }
  if (via) {
    hop.text += ` — via ${via.label}`;
    if (via.cable) hop.cable = via.cable;
  }
  return hop;
}

export interface Crossing {
  from: PartInfo;
  to: PartInfo;
  lead: LeadSpec | undefined;
  pair: number;
  through: string[];
}

function isUnit(p: PartInfo): boolean {
  return p.kind === 'set' || p.kind === 'add-on';
}

/** The first place a path leaves one set (or add-on) by its cord and enters another without passing the KSU. */
export function firstCrossing(nl: Netlist, path: TerminalPath): Crossing | null {
  let lastUnit = -1;
  for (let i = 0; i < path.terms.length; i++) {
    const t = nl.terminals[path.terms[i]];
    const part = nl.parts[t.part];
    if (part.kind === 'ksu') {
      lastUnit = -1;
      continue;
    }
    if (t.pin !== undefined || !isUnit(part)) continue;
    if (lastUnit >= 0 && nl.terminals[path.terms[lastUnit]].part !== t.part) {
      const from = nl.parts[nl.terminals[path.terms[lastUnit]].part];
      const exitPin = path.terms[lastUnit + 1];
      const exitEdge = nl.edges[path.edges[lastUnit]];
      const through: string[] = [];
      for (let j = lastUnit + 1; j < i; j++) {
        const p = nl.parts[nl.terminals[path.terms[j]].part];
        if (p !== from && p !== part && !through.includes(p.name)) through.push(p.name);
      }
      return {
        from,
        to: part,
        lead: exitEdge.lead,
        pair: nl.terminals[exitPin].pair ?? 0,
        through,
      };
    }
    lastUnit = i;
  }
  return null;
}

/** Names of the parts whose own terminals (not just pins) lie on the path, KSU excluded. */
export function unitsAlong(nl: Netlist, path: TerminalPath): string[] {
  const out: string[] = [];
  for (const term of path.terms) {
    const t = nl.terminals[term];
    const p = nl.parts[t.part];
    if (t.pin === undefined && p.kind !== 'ksu' && !out.includes(p.name)) out.push(p.name);
  }
  return out;
}

export function crossingSentence(c: Crossing): string {
  const lead = c.lead ? `${c.lead.role} (${c.lead.designation})` : 'lead';
  const via = c.through.length ? ` through ${c.through.join(' and ')}` : '';
  return `${c.from.name}'s ${lead} on pair ${c.pair} (${pairColour(c.pair).name}) is bridged to ${c.to.name}'s${via}`;
}

/** The first lead by which the path enters a set or add-on from its cord: "Front's A-lead control (AC) on pair 25 (violet-slate)". */
export function firstUnitLeadSentence(nl: Netlist, path: TerminalPath): string | null {
  return unitLeadSentence(nl, path, false);
}

/** The last lead on the path, by which it leaves the last set or add-on it passes for its cord. */
export function lastUnitLeadSentence(nl: Netlist, path: TerminalPath): string | null {
  return unitLeadSentence(nl, path, true);
}

function unitLeadSentence(nl: Netlist, path: TerminalPath, last: boolean): string | null {
  const n = path.edges.length;
  for (let k = 0; k < n; k++) {
    const i = last ? n - 1 - k : k;
    const e = nl.edges[path.edges[i]];
    if (e.kind !== 'lead' || !e.lead) continue;
    const pinTerm = nl.terminals[path.terms[i]].pin !== undefined ? path.terms[i] : path.terms[i + 1];
    const pair = nl.terminals[pinTerm].pair ?? e.lead.pair;
    const part = nl.parts[nl.terminals[pinTerm].part];
    return `${part.name}'s ${e.lead.role} (${e.lead.designation}) on pair ${pair} (${pairColour(pair).name})`;
  }
  return null;
}
