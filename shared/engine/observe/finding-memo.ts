/**
 * Findings kept per netlist and made again only when what they say changes: a rule names everything its finding's
 * text, sets, lines and path depend on (small integers, and the path object, which paths.ts keeps while it holds),
 * and gets the finding it made last time for the same. Findings are never changed once made, so evaluations may
 * share them (as every state already shares the wiring findings).
 */
import type { Netlist } from '../model/netlist';
import type { Finding, FindingCode } from './evaluation.types';
import type { TerminalPath } from './paths';

interface Entry {
  path: TerminalPath | null;
  finding: Finding;
}

/** One code's findings on one netlist: a rule fetches it once per state, then a finding it has costs one look-up. */
export class FindingMemo {
  private readonly entries = new Map<number, Entry>();

  /**
   * The finding kept for `key` and `path`, if any. `key` must tell apart every value the finding depends on
   * besides the path (and the netlist's own names); it stays below 2^52.
   */
  get(key: number, path: TerminalPath | null): Finding | undefined {
    const hit = this.entries.get(path ? key * 2 + 1 : key * 2);
    return hit !== undefined && hit.path === path ? hit.finding : undefined;
  }

  /** Keeps `finding` for `key` and `path` (as get finds it) and returns it. */
  keep(key: number, path: TerminalPath | null, finding: Finding): Finding {
    if (this.entries.size >= MEMO_MAX) this.entries.clear();
    // with and without a path apart: an evaluation with paths and one without each keep theirs
    this.entries.set(path ? key * 2 + 1 : key * 2, { path, finding });
    return finding;
  }

  clear(): void {
    this.entries.clear();
  }
}

const memos = new WeakMap<Netlist, Map<FindingCode, FindingMemo>>();
/** Per netlist and code; past it the memo starts again (a long sweep over a large plan). */
const MEMO_MAX = 1 << 16;

/** The memo of `code`'s findings on `nl`. */
export function findingMemo(nl: Netlist, code: FindingCode): FindingMemo {
  let byCode = memos.get(nl);
  if (!byCode) memos.set(nl, (byCode = new Map()));
  let memo = byCode.get(code);
  if (!memo) byCode.set(code, (memo = new FindingMemo()));
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

/** Small integer ids of lists of small integers, per netlist, as a trie (a known list costs no allocation). */
const listIds = new WeakMap<Netlist, { root: ListNode; size: number }>();

/** Small integer id of a list of small integers (for memo keys that name a list of sets). */
export function listId(nl: Netlist, xs: readonly number[]): number {
  let ids = listIds.get(nl);
  if (!ids) listIds.set(nl, (ids = { root: { id: -1, next: null }, size: 0 }));
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
      listIds.delete(nl);
      memos.get(nl)?.forEach((m) => m.clear());
      return listId(nl, xs);
    }
    node.id = ids.size++;
  }
  return node.id;
}
