/**
 * Training API: classes, invitations, assignments, fault puzzles, runs, demonstrations and the gradebook.
 * Everything a trainee receives while working a puzzle is `.strict()`: there is no field for the plan, its planted
 * faults, the repair or findings, and an answer carrying extra keys fails to parse.
 */
import { z } from 'zod';
import { SimActionSchema, type SimAction } from '../engine/index';
import { DemonstrationSpecSchema } from '../training/demonstration.schema';
import {
  DiagnosisSchema,
  PuzzleLevelSchema,
  PuzzleSpecSchema,
  RepairStepSchema,
} from '../training/puzzle.schema';
import { EmailSchema } from './auth.schema';

const IsoSchema = z.string();
const CadenceSchema = z.enum(['dark', 'steady', 'flash', 'wink']);
const ToneNameSchema = z.enum(['dial', 'ringback', 'busy', 'reorder', 'voice']);

// ---------------------------------------------------------------------------------------------------- classes

export const ClassNameSchema = z.string({ error: 'Name the class' }).trim().min(1, 'Name the class').max(80, 'Keep the name to 80 characters');
export const CreateClassSchema = z.object({ name: ClassNameSchema });
export type CreateClass = z.infer<typeof CreateClassSchema>;

export const ClassSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  ownerName: z.string(),
  traineeCount: z.number().int(),
  pendingCount: z.number().int(),
  createdAt: IsoSchema,
});
export type ClassSummary = z.infer<typeof ClassSummarySchema>;
export const ClassListSchema = z.object({ items: z.array(ClassSummarySchema) });

export const InvitationStatusSchema = z.enum(['pending', 'expired', 'accepted', 'revoked']);
export const RosterEntrySchema = z.object({
  /** "member" rows have joined; "invitation" rows have not (yet). */
  kind: z.enum(['member', 'invitation']),
  userId: z.string().nullable(),
  invitationId: z.string().nullable(),
  email: z.string(),
  displayName: z.string().nullable(),
  status: z.union([z.literal('joined'), InvitationStatusSchema]),
  joinedAt: IsoSchema.nullable(),
  expiresAt: IsoSchema.nullable(),
});
export type RosterEntry = z.infer<typeof RosterEntrySchema>;

export const AssignmentKindSchema = z.enum(['puzzle', 'demonstration']);
export const AssignmentSchema = z.object({
  id: z.string(),
  classId: z.string(),
  kind: AssignmentKindSchema,
  itemId: z.string(),
  title: z.string(),
  level: PuzzleLevelSchema.nullable(),
  dueAt: IsoSchema.nullable(),
});
export type Assignment = z.infer<typeof AssignmentSchema>;

export const ClassDetailSchema = ClassSummarySchema.extend({
  roster: z.array(RosterEntrySchema),
  assignments: z.array(AssignmentSchema),
});
export type ClassDetail = z.infer<typeof ClassDetailSchema>;

export const InviteSchema = z.object({
  emails: z.array(EmailSchema).min(1, 'Enter at least one e-mail address').max(50, 'Invite at most 50 at a time'),
});
export type Invite = z.infer<typeof InviteSchema>;

export const CreateAssignmentSchema = z.object({
  kind: AssignmentKindSchema,
  itemId: z.string().min(1).max(64),
  dueAt: z.iso.datetime({ error: 'Give the due date as a date and time' }).nullable().default(null),
});
export type CreateAssignment = z.infer<typeof CreateAssignmentSchema>;

// ---------------------------------------------------------------------------------------------------- invitations

export const InvitationInfoSchema = z
  .object({
    className: z.string(),
    instructorName: z.string(),
    email: z.string(),
    /** Whether an account with the invited address exists (then sign in to accept). */
    accountExists: z.boolean(),
  })
  .strict();
export type InvitationInfo = z.infer<typeof InvitationInfoSchema>;

export const AcceptInvitationSchema = z.object({
  displayName: z.string().trim().min(1, 'Enter your name').max(60).optional(),
  password: z.string().min(12, 'Use at least 12 characters').max(128, 'Use at most 128 characters').optional(),
});
export type AcceptInvitation = z.infer<typeof AcceptInvitationSchema>;
export const AcceptedSchema = z.object({ classId: z.string(), className: z.string() }).strict();

// ---------------------------------------------------------------------------------------------------- trainee side

export const MyAssignmentSchema = AssignmentSchema.extend({
  bestScore: z.number().int().nullable(),
  status: z.enum(['not-started', 'working', 'passed', 'failed', 'open']),
  runId: z.string().nullable(),
}).strict();
export const MyClassSchema = z
  .object({ id: z.string(), name: z.string(), instructorName: z.string(), assignments: z.array(MyAssignmentSchema) })
  .strict();
export type MyClass = z.infer<typeof MyClassSchema>;
export const MyClassListSchema = z.object({ items: z.array(MyClassSchema) }).strict();

// ---------------------------------------------------------------------------------------------------- runs (strict)

export const LayoutSchema = z
  .object({
    sets: z.array(
      z
        .object({
          id: z.string(),
          name: z.string(),
          keys: z.array(z.object({ index: z.number().int(), label: z.string(), kind: z.enum(['line', 'hold']) }).strict()),
          handsFree: z.boolean(),
        })
        .strict(),
    ),
    lines: z.array(z.object({ number: z.number().int(), label: z.string() }).strict()),
    stations: z.array(z.object({ id: z.string(), code: z.string(), label: z.string() }).strict()),
    /** The sets' station cords, by the set they come from, and how many station ports the KSU has. */
    cords: z.array(z.object({ id: z.string(), label: z.string() }).strict()),
    ksuPorts: z.number().int(),
  })
  .strict();
export type Layout = z.infer<typeof LayoutSchema>;

export const SetSightingSchema = z
  .object({
    set: z.string(),
    offHook: z.boolean(),
    pressedKey: z.number().int().nullable(),
    handsFreeOn: z.boolean(),
    keys: z.array(z.object({ index: z.number().int(), label: z.string(), lamp: CadenceSchema }).strict()),
    tones: z.array(ToneNameSchema),
    buzzer: z.boolean(),
    ringer: z.boolean(),
    hum: z.boolean(),
  })
  .strict();
export type SetSightingView = z.infer<typeof SetSightingSchema>;

export const FarEndSchema = z
  .object({ line: z.number().int(), ringing: z.boolean(), answered: z.boolean() })
  .strict();

export const LogEntrySchema = z.object({ at: IsoSchema, text: z.string() }).strict();

export const ScoreLineSchema = z
  .object({
    item: z.enum(['cleared', 'diagnosis', 'required', 'economy', 'exploration', 'attempts', 'time']),
    label: z.string(),
    points: z.number(),
    max: z.number(),
    note: z.string(),
  })
  .strict();
export const GradeResultSchema = z
  .object({
    passed: z.boolean(),
    score: z.number().int(),
    maxScore: z.number().int(),
    breakdown: z.array(ScoreLineSchema),
    faultCount: z.number().int(),
    faultsCleared: z.number().int(),
    diagnosesRight: z.number().int(),
    requiredKept: z.boolean(),
    unnecessaryChanges: z.number().int(),
    findingsLeft: z.number().int(),
    statesStillDifferent: z.number().int(),
  })
  .strict();
export type GradeResultView = z.infer<typeof GradeResultSchema>;

export const RunStatusSchema = z.enum(['working', 'passed', 'failed']);
export const RunViewSchema = z
  .object({
    id: z.string(),
    assignmentId: z.string(),
    puzzle: z
      .object({ title: z.string(), statement: z.string(), level: PuzzleLevelSchema, attemptLimit: z.number().int() })
      .strict(),
    dueAt: IsoSchema.nullable(),
    layout: LayoutSchema,
    sets: z.array(SetSightingSchema),
    farEnds: z.array(FarEndSchema),
    intercomCalling: z.string().nullable(),
    log: z.array(LogEntrySchema),
    statesTried: z.number().int(),
    attemptsUsed: z.number().int(),
    status: RunStatusSchema,
    bestScore: z.number().int().nullable(),
    lastResult: GradeResultSchema.nullable(),
    startedAt: IsoSchema,
  })
  .strict();
export type RunView = z.infer<typeof RunViewSchema>;

export const RunActionSchema = z.object({ action: SimActionSchema });
export type RunAction = { action: SimAction };

export const SubmissionSchema = z.object({
  diagnoses: z.array(DiagnosisSchema).max(10).default([]),
  repair: z.array(RepairStepSchema).max(30).default([]),
});
export type Submission = z.input<typeof SubmissionSchema>;
export const SubmissionResultSchema = z.object({ result: GradeResultSchema, run: RunViewSchema }).strict();

const HopViewSchema = z
  .object({
    part: z.string(),
    partName: z.string(),
    terminal: z.string().optional(),
    designation: z.string().optional(),
    pair: z.number().int().optional(),
    conductor: z.enum(['tip', 'ring']).optional(),
    colour: z.string().optional(),
    pin: z.number().int().optional(),
    port: z.string().optional(),
    cable: z.string().optional(),
    text: z.string(),
  })
  .strict();
/** Only after a pass or the last attempt. */
export const ExplanationSchema = z
  .object({
    text: z.string(),
    faults: z.array(z.string()),
    repair: z.array(z.string()),
    paths: z.array(z.object({ title: z.string(), hops: z.array(HopViewSchema) }).strict()),
  })
  .strict();
export type ExplanationView = z.infer<typeof ExplanationSchema>;

// ---------------------------------------------------------------------------------------------------- puzzles (instructor)

export const PuzzleSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  level: PuzzleLevelSchema,
  attemptLimit: z.number().int(),
  faultCount: z.number().int(),
  ownerName: z.string(),
  librarySlug: z.string().nullable(),
  createdAt: IsoSchema,
});
export type PuzzleSummary = z.infer<typeof PuzzleSummarySchema>;
export const PuzzleListSchema = z.object({ items: z.array(PuzzleSummarySchema) });
export const PuzzleRecordSchema = PuzzleSummarySchema.extend({ spec: PuzzleSpecSchema });
export type PuzzleRecord = z.infer<typeof PuzzleRecordSchema>;
export const CreatePuzzleSchema = z.object({ spec: z.unknown() });
export const LibraryPuzzleSchema = z.object({
  slug: z.string(),
  title: z.string(),
  level: PuzzleLevelSchema,
  statement: z.string(),
  faultCount: z.number().int(),
});
export const LibraryListSchema = z.object({ items: z.array(LibraryPuzzleSchema) });
export const CopyFromLibrarySchema = z.object({ slug: z.string().min(1).max(60) });

// ---------------------------------------------------------------------------------------------------- demonstrations

export const DemonstrationSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  stepCount: z.number().int(),
  ownerName: z.string(),
  updatedAt: IsoSchema,
});
export type DemonstrationSummary = z.infer<typeof DemonstrationSummarySchema>;
export const DemonstrationListSchema = z.object({ items: z.array(DemonstrationSummarySchema) });
export const DemonstrationRecordSchema = DemonstrationSummarySchema.extend({ spec: DemonstrationSpecSchema });
export type DemonstrationRecord = z.infer<typeof DemonstrationRecordSchema>;
export const SaveDemonstrationSchema = z.object({ spec: DemonstrationSpecSchema });

// ---------------------------------------------------------------------------------------------------- gradebook

export const GradebookCellSchema = z.object({
  assignmentId: z.string(),
  bestScore: z.number().int().nullable(),
  attempts: z.number().int(),
  elapsedMs: z.number().int().nullable(),
  status: z.enum(['not-started', 'working', 'passed', 'failed']),
});
export const GradebookRowSchema = z.object({
  userId: z.string(),
  displayName: z.string(),
  email: z.string(),
  cells: z.array(GradebookCellSchema),
});
export type GradebookRow = z.infer<typeof GradebookRowSchema>;
export const GradebookSchema = z.object({
  classId: z.string(),
  className: z.string(),
  puzzles: z.array(AssignmentSchema),
  rows: z.array(GradebookRowSchema),
});
export type Gradebook = z.infer<typeof GradebookSchema>;

export const ProgressSchema = z
  .object({
    items: z.array(
      z
        .object({
          className: z.string(),
          assignmentId: z.string(),
          title: z.string(),
          level: PuzzleLevelSchema,
          dueAt: IsoSchema.nullable(),
          bestScore: z.number().int().nullable(),
          attempts: z.number().int(),
          elapsedMs: z.number().int().nullable(),
          status: z.enum(['not-started', 'working', 'passed', 'failed']),
        })
        .strict(),
    ),
  })
  .strict();
export type Progress = z.infer<typeof ProgressSchema>;

export const InviteResultSchema = z.object({
  sent: z.array(z.string()),
  /** Invitations saved whose mail the mail server did not take; resend them later. */
  notSent: z.array(z.string()),
  alreadyMembers: z.array(z.string()),
});
export type InviteResult = z.infer<typeof InviteResultSchema>;
