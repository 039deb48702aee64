/**
 * Demonstrations: a plan and an ordered list of steps, each a recorded state of the installation with a short
 * narration and, if any, the finding whose cause the presenter reveals at that step.
 */
import { z } from 'zod';
import { FINDING_CODES, PlanSchema, SimActionSchema, SimStateSchema, type FindingCode } from '../engine/index';

export const RevealSchema = z.object({
  code: z.enum(FINDING_CODES as unknown as [FindingCode, ...FindingCode[]]),
  sets: z.array(z.string()).default([]),
  lines: z.array(z.number().int()).default([]),
  stations: z.array(z.string()).default([]),
});
export type Reveal = z.infer<typeof RevealSchema>;

export const DemonstrationStepSchema = z.object({
  /** The actions that were operated to reach the state, from the plan's idle state. */
  actions: z.array(SimActionSchema).max(60).default([]),
  state: SimStateSchema,
  narration: z.string().trim().max(400).default(''),
  reveal: RevealSchema.nullable().default(null),
});
export type DemonstrationStep = z.infer<typeof DemonstrationStepSchema>;

export const DemonstrationSpecSchema = z.object({
  title: z.string().trim().min(1, 'Give the demonstration a title').max(80),
  plan: PlanSchema,
  steps: z.array(DemonstrationStepSchema).min(1, 'Record at least one step').max(50),
});
export type DemonstrationSpec = z.infer<typeof DemonstrationSpecSchema>;
