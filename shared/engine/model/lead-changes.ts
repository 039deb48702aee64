/**
 * Lead changes, the restorer's work inside a set or an add-on: where each lead ends up, how a change is worded
 * and what lifting leads costs the user.
 */
import type { LeadChange } from '../document/plan.schema';
import type { LeadSpec } from '../templates/template.types';

/** The pair each lead ends up on after the lead changes, or null when lifted. */
export function applyLeadChanges(
  leads: readonly LeadSpec[],
  changes: readonly LeadChange[],
): (number | null)[] {
  const at: (number | null)[] = leads.map((l) => l.pair);
  for (const ch of changes) {
    if (ch.kind === 'lift') {
      leads.forEach((l, i) => {
        if (at[i] === ch.pair && (ch.conductor === 'both' || ch.conductor === l.conductor)) at[i] = null;
      });
    } else {
      const moving = leads.map((_, i) => at[i] === ch.pair);
      moving.forEach((m, i) => {
        if (m) at[i] = ch.toPair;
      });
    }
  }
  return at;
}
