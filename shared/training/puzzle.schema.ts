/**
 * Fault puzzles as data: a healthy plan, the faults planted in it (each a transformation of the plan document),
 * the intended repair, a task statement, a level, an attempt limit and a scoring rubric.
 * Fault kinds are one discriminated union; the wiring faults inside a cable (split pair, reversed pair, open
 * conductor) are planted as the cable's `faults` in the plan document, so the engine shows their symptoms.
 */
import { z } from 'zod';
import {
  CableEndSchema,
  ConductorSchema,
  KsuLeadSchema,
  LeadChangeSchema,
  PairNumberSchema,
  PartIdSchema,
  PlanSchema,
} from '../engine/index';

export const FAULT_KINDS = [
  'lead-left-on',
  'lead-wrongly-lifted',
  'cross-connect-wrong',
  'wrong-set-fitted',
  'cable-wrong-port',
  'split-pair',
  'reversed-pair',
  'open-conductor',
] as const;
export const FaultKindSchema = z.enum(FAULT_KINDS);
export type FaultKind = z.infer<typeof FaultKindSchema>;

/** Plain names for the fault kinds, shown in the diagnosis form and the explanation. */
export const FAULT_KIND_LABELS: Record<FaultKind, string> = {
  'lead-left-on': 'A lead that should have been lifted is still on',
  'lead-wrongly-lifted': 'A lead is lifted that should be on',
  'cross-connect-wrong': 'Wrong cross-connect at the KSU (for example a buzzer on the wrong pair)',
  'wrong-set-fitted': 'The set is the wrong model or option',
  'cable-wrong-port': 'The cable is plugged into the wrong port',
  'split-pair': 'Split pair in the cable (a conductor exchanged with one of another pair)',
  'reversed-pair': 'Reversed pair in the cable (tip and ring swapped)',
  'open-conductor': 'Open conductor in the cable (one wire broken)',
};

const LiftedConductorSchema = z.enum(['tip', 'ring', 'both']);

export const PlantedFaultSchema = z.discriminatedUnion('kind', [
  /** The healthy plan lifts this pair on the part; the faulty one does not. */
  z.object({ kind: z.literal('lead-left-on'), part: PartIdSchema, pair: PairNumberSchema }),
  /** The faulty plan lifts a lead the healthy plan keeps. */
  z.object({
    kind: z.literal('lead-wrongly-lifted'),
    part: PartIdSchema,
    pair: PairNumberSchema,
    conductor: LiftedConductorSchema.default('both'),
  }),
  /** One entry of the KSU cross-connect is different (null: nothing on that pair). */
  z.object({
    kind: z.literal('cross-connect-wrong'),
    port: z.number().int().min(1),
    pair: PairNumberSchema,
    lead: KsuLeadSchema.nullable(),
  }),
  /** The set is built from another template than the one planned. */
  z.object({ kind: z.literal('wrong-set-fitted'), part: PartIdSchema, template: z.string().min(1) }),
  /** One end of a cable sits on another port. */
  z.object({
    kind: z.literal('cable-wrong-port'),
    cable: PartIdSchema,
    end: z.enum(['from', 'to']),
    part: PartIdSchema,
    port: z.string().min(1),
  }),
  /** At one end of the cable a conductor of `pair` is exchanged with the same conductor of `withPair`. */
  z.object({
    kind: z.literal('split-pair'),
    cable: PartIdSchema,
    pair: PairNumberSchema,
    withPair: PairNumberSchema,
    conductor: ConductorSchema,
    end: CableEndSchema,
  }),
  /** At one end of the cable tip and ring of `pair` are exchanged. */
  z.object({ kind: z.literal('reversed-pair'), cable: PartIdSchema, pair: PairNumberSchema, end: CableEndSchema }),
  /** One conductor of `pair` is broken in the cable, near `end`. */
  z.object({
    kind: z.literal('open-conductor'),
    cable: PartIdSchema,
    pair: PairNumberSchema,
    conductor: ConductorSchema,
    end: CableEndSchema,
  }),
]);
export type PlantedFault = z.infer<typeof PlantedFaultSchema>;

/** One step of a repair: work on a set's leads, a cross-connect entry at the KSU, or replugging a cable end. */
export const RepairStepSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('lead'), part: PartIdSchema, change: LeadChangeSchema }),
  /** Undo any lead change on this pair of the part, putting its leads back on their terminals. */
  z.object({ kind: z.literal('restore'), part: PartIdSchema, pair: PairNumberSchema }),
  z.object({
    kind: z.literal('cross-connect'),
    port: z.number().int().min(1).max(24),
    pair: PairNumberSchema,
    lead: KsuLeadSchema.nullable(),
  }),
  z.object({
    kind: z.literal('replug'),
    cable: PartIdSchema,
    end: z.enum(['from', 'to']),
    part: PartIdSchema,
    port: z.string().min(1).max(40),
  }),
  /** Re-terminate (or replace) one pair of a cable at both ends: clears its split, reversal or break. */
  z.object({ kind: z.literal('cable-pair'), cable: PartIdSchema, pair: PairNumberSchema }),
]);
export type RepairStep = z.infer<typeof RepairStepSchema>;

/** The trainee's statement of one fault: where and what. */
export const DiagnosisSchema = z.object({
  part: z.string().min(1).max(40),
  pair: PairNumberSchema.nullable().default(null),
  conductor: ConductorSchema.nullable().default(null),
  kind: FaultKindSchema,
});
export type Diagnosis = z.infer<typeof DiagnosisSchema>;

/** Points and penalties; the positive items add up to the maximum score. */
export const RubricSchema = z.object({
  cleared: z.number().int().min(0).max(100).default(40),
  diagnosis: z.number().int().min(0).max(100).default(25),
  required: z.number().int().min(0).max(100).default(15),
  economy: z.number().int().min(0).max(100).default(10),
  exploration: z.number().int().min(0).max(100).default(10),
  unnecessaryChangePenalty: z.number().int().min(0).max(100).default(5),
  extraAttemptPenalty: z.number().int().min(0).max(100).default(10),
  /** States the trainee should reach before the exploration points are full. */
  minStates: z.number().int().min(1).max(200).default(3),
  targetMinutes: z.number().int().min(1).max(600).default(20),
  latePenalty: z.number().int().min(0).max(100).default(10),
});
export type Rubric = z.infer<typeof RubricSchema>;
export const DEFAULT_RUBRIC: Rubric = RubricSchema.parse({});

export const PuzzleLevelSchema = z.union([z.literal(1), z.literal(2), z.literal(3)]);
export type PuzzleLevel = z.infer<typeof PuzzleLevelSchema>;

export const PuzzleSpecSchema = z.object({
  title: z.string().trim().min(1).max(80),
  /** What the trainee is told: the complaint, never the cause. */
  statement: z.string().trim().min(1).max(2000),
  level: PuzzleLevelSchema,
  attemptLimit: z.number().int().min(1).max(10).default(3),
  rubric: RubricSchema.default(DEFAULT_RUBRIC),
  /** The installation as it should be. */
  plan: PlanSchema,
  faults: z.array(PlantedFaultSchema).min(1).max(6),
  repair: z.array(RepairStepSchema).min(1).max(20),
  /** Shown after a pass or the last attempt. */
  explanation: z.string().trim().min(1).max(4000),
});
export type PuzzleSpec = z.infer<typeof PuzzleSpecSchema>;
export type PuzzleSpecInput = z.input<typeof PuzzleSpecSchema>;

/** A puzzle shipped with Leadbench: a spec with a stable slug. */
export const ShippedPuzzleSchema = PuzzleSpecSchema.extend({ slug: z.string().regex(/^[a-z0-9-]{3,60}$/) });
export type ShippedPuzzle = z.infer<typeof ShippedPuzzleSchema>;
