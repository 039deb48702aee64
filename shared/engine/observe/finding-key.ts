/** The identity of a finding across states and evaluations (the sweep keeps one of each; the bench selects by it). */
import type { Finding } from './evaluation.types';

function sortedText(xs: readonly (string | number)[]): string {
  if (xs.length < 2) return xs.length === 0 ? '' : String(xs[0]);
  if (xs.length === 2) return xs[0] <= xs[1] ? `${xs[0]},${xs[1]}` : `${xs[1]},${xs[0]}`;
  return [...xs].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)).join(',');
}

type Keyed = Pick<Finding, 'code' | 'sets' | 'lines' | 'stations'>;

/**
 * Keys by finding object: findings are never changed once made, and evaluations share them (finding-memo.ts), so a
 * sweep asks for the key of one object in many states.
 */
const keys = new WeakMap<Keyed, string>();

/** Identity of a finding across states: code + sets + lines + stations, each in sorted order. */
export function findingKey(f: Keyed): string {
  let key = keys.get(f);
  if (key === undefined) {
    key = `${f.code}|${sortedText(f.sets)}|${sortedText(f.lines)}|${sortedText(f.stations)}`;
    keys.set(f, key);
  }
  return key;
}
