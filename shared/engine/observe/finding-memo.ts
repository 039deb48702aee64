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

const memos = new WeakMap<Netlist, Map<FindingCode, Map<number, Entry>>>();
/** Per netlist and code; past it the memo starts again (a long sweep over a large plan). */
const MEMO_MAX = 1 << 16;

/** Position of a finding about one set in the listing (set, then first line), kept by the rules that know it. */
export const orderOf = new WeakMap<Finding, number>();

const lineIndexCache = new WeakMap<Netlist, Map<number, number>>();

/** Position in the listing of a finding about one set: the set's index, then the first line's index. */
export function bySetPosition(nl: Netlist, f: Finding): number {
  let lineIndex = lineIndexCache.get(nl);
  if (!lineIndex) {
    lineIndex = new Map(nl.lines.map((l, i) => [l.number, i]));
    lineIndexCache.set(nl, lineIndex);
  }
  const set = nl.setById.get(f.sets[0])?.index ?? 0;
  const line = f.lines.length ? (lineIndex.get(f.lines[0]) ?? -1) : -1;
  return set * (nl.lines.length + 1) + line + 1;
}

/** A finding about one set, its listing position kept with it (a memo hit then needs no look-up). */
export function bySetFinding(nl: Netlist, f: Finding): Finding {
  orderOf.set(f, bySetPosition(nl, f));
  return f;
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
  let byCode = memos.get(nl);
  if (!byCode) memos.set(nl, (byCode = new Map()));
  let memo = byCode.get(code);
  if (!memo) byCode.set(code, (memo = new Map()));
  // with and without a path apart: an evaluation with paths and one without each keep theirs
  const k = path ? key * 2 + 1 : key * 2;
  const hit = memo.get(k);
  if (hit !== undefined && hit.path === path) return hit.finding;
  const finding = make();
  if (memo.size >= MEMO_MAX) memo.clear();
  memo.set(k, { path, finding });
  return finding;
}

/** More than any set's key index (fillMech keeps a latched key within the set's keys). */
export const KEY_SLOTS = 4096;

/** Small integer ids of lists of small integers, per netlist (for memo keys that name a list of sets). */
const listIds = new WeakMap<Netlist, Map<string, number>>();

export function listId(nl: Netlist, xs: readonly number[]): number {
  let ids = listIds.get(nl);
  if (!ids) listIds.set(nl, (ids = new Map()));
  const text = xs.join(',');
  let id = ids.get(text);
  if (id === undefined) {
    if (ids.size >= MEMO_MAX) {
      // ids are about to mean other lists: forget the findings kept under them
      ids.clear();
      memos.delete(nl);
    }
    ids.set(text, (id = ids.size));
  }
  return id;
}
