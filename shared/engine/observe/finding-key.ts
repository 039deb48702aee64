/** The identity of a finding across states and evaluations (the sweep keeps one of each; the bench selects by it). */
import type { Finding } from './evaluation.types';

function sortedText(xs: readonly (string | number)[]): string {
  if (xs.length < 2) return xs.length === 0 ? '' : String(xs[0]);
  if (xs.length === 2) return xs[0] <= xs[1] ? `${xs[0]},${xs[1]}` : `${xs[1]},${xs[0]}`;
  return [...xs].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)).join(',');
}

/** Identity of a finding across states: code + sets + lines + stations, each in sorted order. */
export function findingKey(f: Pick<Finding, 'code' | 'sets' | 'lines' | 'stations'>): string {
  return `${f.code}|${sortedText(f.sets)}|${sortedText(f.lines)}|${sortedText(f.stations)}`;
}
