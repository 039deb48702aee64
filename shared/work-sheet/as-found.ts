/**
 * Every set and add-on as found: its leads as wired, that is the plan's leads with none of its lead changes
 * applied. Kept before any lead change so the installation can be put back as it was.
 */
import { getTemplate, leadTable, pinOf, type Plan } from '../engine/index';
import type { AsFoundPart } from '../schemas/work-record.schema';

/** The plan as wired before the restorer's work: the same parts with every lead change taken out. */
export function planAsWired(plan: Plan): Plan {
  return {
    ...plan,
    sets: plan.sets.map((s) => ({ ...s, leadChanges: [] })),
    addOns: plan.addOns.map((a) => ({ ...a, leadChanges: [] })),
  };
}

export function asFound(plan: Plan): AsFoundPart[] {
  const wired = planAsWired(plan);
  const parts = [
    ...wired.sets.map((doc) => ({ doc, kind: 'set' as const })),
    ...wired.addOns.map((doc) => ({ doc, kind: 'add-on' as const })),
  ];
  return parts.map(({ doc, kind }) => ({
    partId: doc.id,
    kind,
    name: doc.name,
    templateTitle: getTemplate(doc.template)?.title ?? doc.template,
    leads: leadTable(wired, doc.id)
      .filter((row) => row.designationTip !== null || row.designationRing !== null)
      .map((row) => ({
        pair: row.pair,
        colour: row.colourName,
        tip: row.designationTip,
        ring: row.designationRing,
        pins: { tip: pinOf(row.pair, 'tip'), ring: pinOf(row.pair, 'ring') },
        purpose: row.purpose,
      })),
  }));
}
