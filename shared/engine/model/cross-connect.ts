/** The KSU's station-port cross-connect: which pair of which port carries which line-circuit lead or intercom output. */
import type { CrossConnect, Ksu } from '../document/plan.schema';
import { BUZZER_PAIR, standardLinePairs, tenKeyExtraPairs } from '../templates/part-templates';

/** Highest line the station plan has pairs for. */
export const STANDARD_PLAN_MAX_LINE = 9;

/**
 * The standard station plan on every port: line k's pairs for k ≤ min(lines, 9), and pair 18 of port p
 * to the buzzer output of the p-th intercom station.
 */
export function standardCrossConnect(ksu: Pick<Ksu, 'lines' | 'stations' | 'ports'>): CrossConnect[] {
  const out: CrossConnect[] = [];
  const lineCount = Math.min(ksu.lines.length, STANDARD_PLAN_MAX_LINE);
  for (let port = 1; port <= ksu.ports; port++) {
    for (let line = 1; line <= lineCount; line++) {
      if (line <= 5) {
        const p = standardLinePairs(line);
        out.push({ port, pair: p.talk, lead: { kind: 'line-talk', line } });
        out.push({ port, pair: p.a, lead: { kind: 'line-a', line } });
        out.push({ port, pair: p.lamp, lead: { kind: 'line-lamp', line } });
      } else {
        const p = tenKeyExtraPairs(line);
        out.push({ port, pair: p.talk, lead: { kind: 'line-talk', line } });
        out.push({ port, pair: p.aLamp, lead: { kind: 'line-a-lamp', line } });
      }
    }
    const station = ksu.stations[port - 1];
    if (station) out.push({ port, pair: BUZZER_PAIR, lead: { kind: 'buzzer', station: station.id } });
  }
  return out;
}

/** The cross-connect in force: the plan's own, or the standard one. */
export function effectiveCrossConnect(ksu: Ksu): CrossConnect[] {
  return ksu.crossConnect ?? standardCrossConnect(ksu);
}
