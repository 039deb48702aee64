/**
 * Findings kept and made again only when what they say changes: a rule names everything its finding's text, sets,
 * lines and path depend on (small integers, and the path), and gets the finding it made last time for the same.
 * Findings are never changed once made, so evaluations may share them (as every state already shares the wiring
 * findings).
 *
 * Kept across netlists too: an edit that rewires leads or cables makes a new netlist whose parts, names, loads and
 * contacts are all as they were (the memo's `layout`). A key then still means what it meant, and a path means the
 * same when it runs over the same terminal and wire objects (cached part wirings push the same objects again,
 * see netlist.ts); a path over anything the edit rewired is not found, and its finding is made again.
 */
import { perNetlist, rewiringOf, type Netlist } from '../model/netlist';
import type { Finding, FindingCode } from './evaluation.types';
import { pathObjects, runsOver, type PathObjects, type TerminalPath } from './paths';

interface Entry {
  /** The path it was last found with, and that path's terminal and wire objects (null: no path). */
  path: TerminalPath | null;
  objects: PathObjects | null;
  finding: Finding;
}

/** The findings and list ids of every netlist with one layout. */
interface Store {
  byCode: Map<FindingCode, Map<number, Entry>>;
  lists: { root: ListNode; size: number };
}

/** One code's findings on one netlist: a rule fetches it once per state, then a finding it has costs one look-up. */
export class FindingMemo {
  constructor(
    private readonly nl: Netlist,
    private readonly entries: Map<number, Entry>,
  ) {}

  /**
   * The finding kept for `key` and `path`, if any. `key` must tell apart every value the finding depends on
   * besides the path (and the netlist's own names); it stays below 2^52.
   */
  get(key: number, path: TerminalPath | null): Finding | undefined {
    const hit = this.entries.get(path ? key * 2 + 1 : key * 2);
    if (hit === undefined) return undefined;
    if (hit.path === path) return hit.finding;
    if (path === null || !hit.objects || !runsOver(this.nl, path, hit.objects)) return undefined;
    // the same conductors by another path object (another netlist or tree): found by identity from now on
    hit.path = path;
    return hit.finding;
  }

  /** Keeps `finding` for `key` and `path` (as get finds it) and returns it. */
  keep(key: number, path: TerminalPath | null, finding: Finding): Finding {
    if (this.entries.size >= MEMO_MAX) this.entries.clear();
    // with and without a path apart: an evaluation with paths and one without each keep theirs
    this.entries.set(path ? key * 2 + 1 : key * 2, {
      path,
      objects: path && pathObjects(this.nl, path),
      finding,
    });
    return finding;
  }
}

/**
 * Everything of a netlist that a finding may read besides its path and its state's nets: parts (ids, names,
 * templates, who serves whom), the sets' stations, lines, stations, loads (ringer straps among them) and terminal
 * ids; contacts follow from the templates and owners. Netlists that differ only in wires share one store.
 */
const layoutOf = perNetlist((nl): string => {
  // a netlist rewired from another has its parts, terminals, loads and contacts (model/netlist.ts rewiredFrom)
  const before = rewiringOf(nl)?.prev;
  if (before) return layoutOf(before);
  const parts = nl.parts.map(
    (p) => `${p.kind}|${p.id}|${p.name}|${p.template?.id ?? ''}|${p.setIndex}|${p.servesSet}`,
  );
  const sets = nl.sets.map((s) => `${s.station ?? ''}|${s.addOns.join(',')}`);
  const lines = nl.lines.map((l) => `${l.number}|${l.directoryNumber}|${l.t}|${l.r}|${l.a}|${l.l}`);
  const stations = nl.stations.map((s) => `${s.id}|${s.code}|${s.t}|${s.r}`);
  const loads = nl.elements.map((e) => `${e.kind}|${e.a}|${e.b}|${e.owner}|${e.line ?? ''}|${e.key ?? ''}`);
  const contacts = `${nl.contacts.length}|${nl.terminals.length}|${nl.gnd}`;
  return [parts.join('\n'), sets.join('\n'), lines.join('\n'), stations.join('\n'), loads.join('\n'), contacts].join(
    '\n#\n',
  );
});

/** Stores by layout, least recently used first (an editing session moves between a few layouts). */
const stores = new Map<string, Store>();
const STORES_MAX = 8;

/** Per netlist, its memos by code and its store (looked up by layout once per netlist). */
const memos = perNetlist((nl): { store: Store; byCode: Map<FindingCode, FindingMemo> } => {
  const layout = layoutOf(nl);
  let store = stores.get(layout);
  if (store) stores.delete(layout);
  else {
    store = { byCode: new Map(), lists: { root: { id: -1, next: null }, size: 0 } };
    if (stores.size >= STORES_MAX) stores.delete(stores.keys().next().value!);
  }
  stores.set(layout, store);
  return { store, byCode: new Map() };
});

/** Per layout and code; past it the memo starts again (a long sweep over a large plan). */
const MEMO_MAX = 1 << 16;

/** The memo of `code`'s findings on `nl`. */
export function findingMemo(nl: Netlist, code: FindingCode): FindingMemo {
  const { store, byCode } = memos(nl);
  let memo = byCode.get(code);
  if (!memo) {
    let entries = store.byCode.get(code);
    if (!entries) store.byCode.set(code, (entries = new Map()));
    byCode.set(code, (memo = new FindingMemo(nl, entries)));
  }
  return memo;
}

/** Position in the listing of a finding about one set: the set's index, then its first line's index (or none). */
export function bySetPosition(nl: Netlist, setIndex: number, lineIndex: number): number {
  return setIndex * (nl.lines.length + 1) + lineIndex + 1;
}

/**
 * The finding `make` makes for `key` and `path`, made once. `key` must tell apart every value the finding
 * depends on besides the path (and the netlist's own names); it stays below 2^52 (-1: no key, made every time).
 */
export function memoFinding(
  nl: Netlist,
  code: FindingCode,
  key: number,
  path: TerminalPath | null,
  make: () => Finding,
): Finding {
  if (key < 0) return make();
  const memo = findingMemo(nl, code);
  return memo.get(key, path) ?? memo.keep(key, path, make());
}

/** More than any set's key index (fillMech keeps a latched key within the set's keys). */
export const KEY_SLOTS = 4096;

/** A node of the trie of lists: the id of the list that ends here (-1: none yet) and the lists that go on. */
interface ListNode {
  id: number;
  next: Map<number, ListNode> | null;
}

/** Small integer id of a list of small integers (for memo keys that name a list of sets), per layout, as a trie. */
export function listId(nl: Netlist, xs: readonly number[]): number {
  const { store } = memos(nl);
  const ids = store.lists;
  let node = ids.root;
  for (let i = 0; i < xs.length; i++) {
    let child = node.next?.get(xs[i]);
    if (!child) {
      child = { id: -1, next: null };
      (node.next ??= new Map()).set(xs[i], child);
    }
    node = child;
  }
  if (node.id < 0) {
    if (ids.size >= MEMO_MAX) {
      // ids are about to mean other lists: forget them and the findings kept under them
      store.lists = { root: { id: -1, next: null }, size: 0 };
      store.byCode.forEach((entries) => entries.clear());
      return listId(nl, xs);
    }
    node.id = ids.size++;
  }
  return node.id;
}
