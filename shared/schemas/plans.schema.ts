/** Saved plans: named plan documents owned by one user. */
import { z } from 'zod';
import { PlanSchema } from '../engine/document/plan.schema';

export const PlanSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  setCount: z.number().int(),
  updatedAt: z.string(),
  createdAt: z.string(),
});
export type PlanSummary = z.infer<typeof PlanSummarySchema>;

export const PlanRecordSchema = PlanSummarySchema.extend({ document: PlanSchema });
export type PlanRecord = z.infer<typeof PlanRecordSchema>;

export const PlanCreateSchema = z.object({ document: PlanSchema });
export type PlanCreate = z.infer<typeof PlanCreateSchema>;

/** Updates carry the timestamp the client last saw, so a stale tab cannot overwrite newer work. */
export const PlanUpdateSchema = z.object({ document: PlanSchema, baseUpdatedAt: z.string().optional() });
export type PlanUpdate = z.infer<typeof PlanUpdateSchema>;

export const PlanListSchema = z.object({ items: z.array(PlanSummarySchema) });
export type PlanList = z.infer<typeof PlanListSchema>;
