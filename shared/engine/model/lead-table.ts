/** The lead table of one set or add-on: what each cord pair carries, after the lead changes. */
import { applyLeadChanges } from './lead-changes';
import { getTemplate } from '../templates/part-templates';
import type { LeadScope } from '../templates/template.types';
import { pairColour, PAIR_COUNT } from '../document/cable-code';
import type { Plan } from '../document/plan.schema';

export interface LeadRow {
  pair: number;
  tipColour: string;
  ringColour: string;
  colourName: string;
  designationTip: string | null;
  designationRing: string | null;
  purpose: string;
  scope: LeadScope | null;
  state: 'connected' | 'lifted' | 'moved' | 'spare';
  movedTo?: number;
  /** Leads moved onto this pair from another one. */
  movedFrom?: number[];
}

/** One row per cord pair (1–25) of a set or add-on; [] for unknown parts or parts without leads. */
export function leadTable(plan: Plan, partId: string): LeadRow[] {
  const part = plan.sets.find((s) => s.id === partId) ?? plan.addOns.find((a) => a.id === partId);
  const tpl = part ? getTemplate(part.template) : undefined;
  if (!part || !tpl?.leadPort) return [];
  const at = applyLeadChanges(tpl.leads, part.leadChanges);
  const rows: LeadRow[] = [];
  for (let pair = 1; pair <= PAIR_COUNT; pair++) {
    const c = pairColour(pair);
    const idx = tpl.leads.map((l, i) => (l.pair === pair ? i : -1)).filter((i) => i >= 0);
    const tip = idx.map((i) => tpl.leads[i]).find((l) => l.conductor === 'tip');
    const ring = idx.map((i) => tpl.leads[i]).find((l) => l.conductor === 'ring');
    const moved = idx.map((i) => at[i]).find((p) => p !== null && p !== pair) ?? undefined;
    const lifted = idx.length > 0 && idx.every((i) => at[i] === null);
    const incoming = tpl.leads
      .map((l, i) => (at[i] === pair && l.pair !== pair ? l.pair : -1))
      .filter((p, i, arr) => p >= 0 && arr.indexOf(p) === i);
    const lead = tip ?? ring;
    rows.push({
      pair,
      tipColour: c.tip,
      ringColour: c.ring,
      colourName: c.name,
      designationTip: tip?.designation ?? null,
      designationRing: ring?.designation ?? null,
      purpose: lead ? [tip?.purpose, ring?.purpose].filter(Boolean).join(' / ') : 'Spare',
      scope: lead?.scope ?? null,
      state: !idx.length ? 'spare' : lifted ? 'lifted' : moved !== undefined ? 'moved' : 'connected',
      ...(moved !== undefined ? { movedTo: moved } : {}),
      ...(incoming.length ? { movedFrom: incoming } : {}),
    });
  }
  return rows;
}
