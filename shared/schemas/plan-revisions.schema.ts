/** Saved versions of a plan and the readable list of changes between two of them. */
import { z } from 'zod';
import { PlanSchema } from '../engine/document/plan.schema';
import { PLAN_CHANGE_KINDS } from '../plans/plan-diff';

export const RevisionReasonSchema = z.enum(['create', 'save', 'restore', 'import', 'copy']);
export type RevisionReason = z.infer<typeof RevisionReasonSchema>;

export const PlanRevisionSummarySchema = z.object({
  number: z.number().int(),
  createdAt: z.string(),
  /** Display name of who saved it; empty when that account is gone. */
  authorName: z.string(),
  reason: RevisionReasonSchema,
  /** For a restore: the revision whose document came back. */
  restoredFrom: z.number().int().nullable(),
  name: z.string(),
  setCount: z.number().int(),
});
export type PlanRevisionSummary = z.infer<typeof PlanRevisionSummarySchema>;

export const PlanRevisionListSchema = z.object({ items: z.array(PlanRevisionSummarySchema) });
export type PlanRevisionList = z.infer<typeof PlanRevisionListSchema>;

export const PlanRevisionSchema = PlanRevisionSummarySchema.extend({ document: PlanSchema });
export type PlanRevision = z.infer<typeof PlanRevisionSchema>;

export const RevisionParamsSchema = z.object({
  id: z.string().min(1).max(64),
  rev: z.coerce.number({ error: 'Use a revision number' }).int().min(1, 'Revisions start at 1'),
});

export const RevisionCompareQuerySchema = z.object({
  from: z.coerce.number({ error: 'Use a revision number' }).int().min(1),
  to: z.coerce.number({ error: 'Use a revision number' }).int().min(1),
});

export const PlanChangeSchema = z.object({
  kind: z.enum(PLAN_CHANGE_KINDS),
  /** Id of the part the change is about, when there is one. */
  part: z.string().optional(),
  text: z.string(),
});

export const PlanCompareSchema = z.object({
  from: z.number().int(),
  to: z.number().int(),
  changes: z.array(PlanChangeSchema),
});
export type PlanCompare = z.infer<typeof PlanCompareSchema>;

export const RestoreRevisionSchema = z.object({
  baseUpdatedAt: z.string({ error: 'Send the time you last loaded the plan' }).min(1),
});
