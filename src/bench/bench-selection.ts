/**
 * What the Bench's selection means for the drawing, as pure functions of the plan and the finding: which parts and
 * cables a finding lights up, and whether a selected part survives an edit.
 */
import type { Finding, Plan } from '@shared/engine';
import { partIds } from './plan-edits';

export interface Highlight {
  parts: Set<string>;
  cables: Set<string>;
}

/** Parts and cables on a finding's conductor path, and the sets it names; nothing when no finding is chosen. */
export function highlightOf(finding: Finding | null): Highlight {
  const parts = new Set<string>();
  const cables = new Set<string>();
  if (finding) {
    for (const hop of finding.path) {
      parts.add(hop.part);
      if (hop.cable) cables.add(hop.cable);
    }
    finding.sets.forEach((s) => parts.add(s));
  }
  return { parts, cables };
}

/** The selected part if it is still in the plan, otherwise no selection. */
export function keptSelection(plan: Plan, selected: string | null): string | null {
  return selected !== null && partIds(plan).has(selected) ? selected : null;
}
