/** What the KSU puts on a station-port pair, in the trade's words (the cross-connect vocabulary). */
import type { KsuLead, Plan } from './plan.schema';

export type LineKsuLeadKind = Exclude<KsuLead['kind'], 'buzzer'>;

/** Per line lead kind: its name and the designations of its two conductors (tip first). */
export const KSU_LEAD_NAMES: Readonly<Record<LineKsuLeadKind, { name: string; leads: string }>> = {
  'line-talk': { name: 'talk pair', leads: 'T, R' },
  'line-a': { name: 'A-lead pair', leads: 'A, A1' },
  'line-lamp': { name: 'lamp pair', leads: 'L, LG' },
  'line-a-lamp': { name: 'A-lead and lamp lead', leads: 'A, L' },
};

/** The dial code of a station, or its id when the KSU has no such station. */
export function stationCode(plan: Plan, stationId: string): string {
  return plan.ksu.stations.find((s) => s.id === stationId)?.code ?? stationId;
}

/** "line 2 talk pair (T, R)", "buzzer output of intercom station 21". */
export function describeKsuLead(plan: Plan, lead: KsuLead): string {
  if (lead.kind === 'buzzer') return `buzzer output of intercom station ${stationCode(plan, lead.station)}`;
  const { name, leads } = KSU_LEAD_NAMES[lead.kind];
  return `line ${lead.line} ${name} (${leads})`;
}
