/**
 * The work record of a plan: every set and add-on as found before any lead change (so the work can be put back),
 * and the bench's tick-offs (date stamped by the server, the restorer's initials) and notes per step or part.
 */
import { z } from 'zod';

export const AsFoundLeadSchema = z.object({
  pair: z.number().int().min(1).max(25),
  /** The pair's colour name in the 25-pair code, e.g. "white-blue". */
  colour: z.string().max(40),
  tip: z.string().max(40).nullable(),
  ring: z.string().max(40).nullable(),
  pins: z.object({ tip: z.number().int(), ring: z.number().int() }),
  purpose: z.string().max(200),
});
export type AsFoundLead = z.infer<typeof AsFoundLeadSchema>;

export const AsFoundPartSchema = z.object({
  partId: z.string().max(40),
  kind: z.enum(['set', 'add-on']),
  name: z.string().max(60),
  templateTitle: z.string().max(80),
  leads: z.array(AsFoundLeadSchema).max(25),
});
export type AsFoundPart = z.infer<typeof AsFoundPartSchema>;

/** A step of the sheet (`step:<part id>:<n>`, `xc:<port>:<pair>`) or a part's own notes (`part:<id>`). */
export const WorkEntryKeySchema = z
  .string()
  .min(1)
  .max(100)
  .regex(/^(step|xc|part):[A-Za-z0-9._:-]+$/, 'Not a step or part of this work sheet');

export const WorkEntrySchema = z.object({
  key: z.string(),
  done: z.boolean(),
  doneAt: z.string().nullable(),
  initials: z.string(),
  note: z.string(),
  updatedAt: z.string(),
});
export type WorkEntry = z.infer<typeof WorkEntrySchema>;

export const WorkRecordSchema = z.object({
  planId: z.string(),
  /** When the as-found record was kept; null while nothing is recorded yet (then `asFound` is the plan today). */
  recordedAt: z.string().nullable(),
  asFound: z.array(AsFoundPartSchema).max(500),
  entries: z.array(WorkEntrySchema),
});
export type WorkRecord = z.infer<typeof WorkRecordSchema>;

export const INITIALS_MAX = 8;
export const WORK_NOTE_MAX = 1000;

export const WorkEntryUpdateSchema = z
  .object({
    done: z.boolean(),
    initials: z.string().trim().max(INITIALS_MAX, `Initials are at most ${INITIALS_MAX} letters`).default(''),
    note: z.string().trim().max(WORK_NOTE_MAX, `Keep notes to ${WORK_NOTE_MAX} characters`).default(''),
  })
  .refine((v) => !v.done || v.initials.length > 0, {
    path: ['initials'],
    message: 'Write your initials to tick a step off',
  });
export type WorkEntryUpdate = z.input<typeof WorkEntryUpdateSchema>;

export const WorkEntryParamsSchema = z.object({
  id: z.string().min(1).max(64),
  key: WorkEntryKeySchema,
});
