/**
 * Whether an edit may be recorded: a read-only plan (shared to view, an old revision, a guest's limits) refuses
 * every edit with its reason before the edit's own answer is looked at.
 */
import type { EditOutcome } from './plan-edits';

export type EditResult = { ok: true } | { ok: false; reason: string };

/** The refusal to give for this edit, or null when it may be recorded. */
export function refusalOf(readOnlyReason: string | null, outcome: EditOutcome): EditResult | null {
  if (readOnlyReason !== null) return { ok: false, reason: readOnlyReason };
  if (!outcome.ok) return outcome;
  return null;
}
