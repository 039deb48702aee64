/** Saved plans: named plan documents owned by one user, listed a page at a time, viewable by those it is shared with. */
import { z } from 'zod';
import { PlanSchema } from '../engine/document/plan.schema';

/** What the asking user may do with a plan: everything (owner) or look, operate and copy (viewer). */
export const PlanAccessSchema = z.enum(['owner', 'viewer']);
export type PlanAccess = z.infer<typeof PlanAccessSchema>;

export const PlanSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  setCount: z.number().int(),
  /** Faults the bounded sweep found when the plan was last saved. */
  faultCount: z.number().int(),
  /** The owner has shared it with someone or by a link that still works. */
  shared: z.boolean(),
  access: PlanAccessSchema,
  ownerName: z.string(),
  updatedAt: z.string(),
  createdAt: z.string(),
  /** Set while the plan is in the owner's recently deleted list. */
  deletedAt: z.string().nullable(),
});
export type PlanSummary = z.infer<typeof PlanSummarySchema>;

export const PlanRecordSchema = PlanSummarySchema.extend({
  document: PlanSchema,
  /** Number of the revision this document is. */
  revision: z.number().int(),
});
export type PlanRecord = z.infer<typeof PlanRecordSchema>;

export const PlanCreateSchema = z.object({ document: PlanSchema });
export type PlanCreate = z.infer<typeof PlanCreateSchema>;

/** Updates carry the timestamp the client last saw, so a stale tab cannot overwrite newer work. */
export const PlanUpdateSchema = z.object({
  document: PlanSchema,
  baseUpdatedAt: z.string({ error: 'Send the time you last loaded the plan' }).min(1),
});
export type PlanUpdate = z.infer<typeof PlanUpdateSchema>;

export const PlanRenameSchema = z.object({
  name: PlanSchema.shape.name,
  baseUpdatedAt: z.string({ error: 'Send the time you last loaded the plan' }).min(1),
});
export type PlanRename = z.infer<typeof PlanRenameSchema>;

/** A copy of a plan one may see, under an optional new name ("Copy of …" otherwise). */
export const PlanDuplicateSchema = z.object({ name: PlanSchema.shape.name.optional() });
export type PlanDuplicate = z.infer<typeof PlanDuplicateSchema>;

export const PLAN_SORTS = ['name', 'setCount', 'faultCount', 'updatedAt', 'shared'] as const;
export const PLAN_SCOPES = ['mine', 'shared', 'deleted'] as const;
export const PLAN_PAGE_SIZES = [10, 20, 50] as const;

const PageNumber = z.coerce.number({ error: 'Use a page number' }).int().min(1, 'Pages start at 1');

export const PlanListQuerySchema = z.object({
  /** mine: my plans; shared: plans others share with me; deleted: my recently deleted plans. */
  scope: z.enum(PLAN_SCOPES).default('mine'),
  /** Matches the name or the description, ignoring case. */
  q: z.string().trim().max(60, 'Search for at most 60 characters').default(''),
  sort: z.enum(PLAN_SORTS).default('updatedAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
  page: PageNumber.default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'At most 100 plans a page').default(20),
});
export type PlanListQuery = z.infer<typeof PlanListQuerySchema>;
/** What a client sends: every field optional, numbers as numbers. */
export type PlanListParams = Partial<
  Omit<PlanListQuery, 'page' | 'pageSize'> & { page: number; pageSize: number }
>;

/** How much of the account's room the plans take, against the limits the server is set to. */
export const PlanUsageSchema = z.object({
  plans: z.number().int(),
  maxPlans: z.number().int(),
  bytes: z.number().int(),
  maxBytes: z.number().int(),
  maxSets: z.number().int(),
});
export type PlanUsage = z.infer<typeof PlanUsageSchema>;

export const PlanListSchema = z.object({
  items: z.array(PlanSummarySchema),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
  usage: PlanUsageSchema,
});
export type PlanList = z.infer<typeof PlanListSchema>;
