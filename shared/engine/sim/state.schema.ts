/** Operating state of a plan and the actions a user takes: plain JSON, validated with zod for the CLI and server. */
import { z } from 'zod';

export const FarPhaseSchema = z.enum([
  'idle',
  'dial-tone',
  'dialling',
  'ringback',
  'talking',
  'busy',
  'reorder',
  'incoming',
  'answered',
]);
export type FarPhase = z.infer<typeof FarPhaseSchema>;

/** The exchange and the far party as seen from one line. */
export const FarStateSchema = z.object({
  phase: FarPhaseSchema.default('idle'),
  digits: z
    .string()
    .regex(/^[0-9]*$/)
    .default(''),
  calledNumber: z.string().nullable().default(null),
});
export type FarState = z.infer<typeof FarStateSchema>;

export const SetStateSchema = z.object({
  offHook: z.boolean().default(false),
  /** Index of the latched line key, or null when all keys are released. */
  pressedKey: z.number().int().min(1).nullable().default(null),
  handsFreeOn: z.boolean().default(false),
});
export type SetState = z.infer<typeof SetStateSchema>;

export const LineCircuitSchema = z.enum(['idle', 'in-use', 'held']);
export type LineCircuit = z.infer<typeof LineCircuitSchema>;

export const LineStateSchema = z.object({
  line: z.number().int().min(1),
  circuit: LineCircuitSchema.default('idle'),
  ringing: z.boolean().default(false),
  far: FarStateSchema.default({ phase: 'idle', digits: '', calledNumber: null }),
  /** The line went on hold without any set that pressed hold having it selected. */
  heldWithoutSelection: z.boolean().optional(),
});
export type LineState = z.infer<typeof LineStateSchema>;

export const SimStateSchema = z.object({
  /** Keyed by set id. */
  sets: z.record(z.string(), SetStateSchema).default({}),
  lines: z.array(LineStateSchema).default([]),
  intercom: z.object({ calling: z.string().nullable().default(null) }).default({ calling: null }),
});
export type SimState = z.infer<typeof SimStateSchema>;

const setRef = { set: z.string().min(1) };
export const SimActionSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('lift-handset'), ...setRef }),
  z.object({ kind: z.literal('hang-up'), ...setRef }),
  /** Line key index; pressing the hold key's index is the same as press-hold. */
  z.object({ kind: z.literal('press-key'), ...setRef, key: z.number().int().min(1) }),
  z.object({ kind: z.literal('press-hold'), ...setRef }),
  z.object({ kind: z.literal('release-keys'), ...setRef }),
  z.object({ kind: z.literal('hands-free'), ...setRef, on: z.boolean() }),
  z.object({ kind: z.literal('dial'), ...setRef, digits: z.string().regex(/^[0-9]+$/, 'Digits only') }),
  /** Time passes without dialling: an incomplete number gets reorder. */
  z.object({ kind: z.literal('pause') }),
  z.object({ kind: z.literal('ring-line'), line: z.number().int().min(1) }),
  z.object({ kind: z.literal('stop-ringing'), line: z.number().int().min(1) }),
  z.object({ kind: z.literal('far-answer'), line: z.number().int().min(1) }),
  z.object({ kind: z.literal('far-hang-up'), line: z.number().int().min(1) }),
  z.object({ kind: z.literal('intercom-call'), station: z.string().min(1) }),
  z.object({ kind: z.literal('intercom-end') }),
]);
export type SimAction = z.infer<typeof SimActionSchema>;
