/**
 * The plan document: the serialisable description of one installation.
 * Plain JSON, versioned, validated with zod. Everything the engine computes starts from here.
 * Every array and string has an upper bound, so a hostile document is cheap to refuse.
 */
import { z } from 'zod';

export const PLAN_VERSION = 1 as const;

/** Part ids are short slugs so they read well in paths and file names. */
export const PartIdSchema = z
  .string()
  .regex(/^[a-z][a-z0-9-]{0,39}$/, 'Use 1–40 lower-case letters, digits or dashes, starting with a letter');
export type PartId = z.infer<typeof PartIdSchema>;

export const PairNumberSchema = z.number().int().min(1).max(25);
export const ConductorSchema = z.enum(['tip', 'ring']);
export type Conductor = z.infer<typeof ConductorSchema>;

export const PositionSchema = z.object({ x: z.number().finite(), y: z.number().finite() });
export type Position = z.infer<typeof PositionSchema>;

const NameSchema = z.string().trim().min(1, 'A name is required').max(60, 'Keep names to 60 characters');

/**
 * A lead change made inside one set (or add-on): the restorer's work.
 * - lift: take the lead(s) of this cable pair off their terminals and insulate them.
 * - move: re-terminate the lead(s) of this cable pair on another (spare) pair of the mounting cord.
 */
export const LeadChangeSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('lift'),
    pair: PairNumberSchema,
    conductor: z.enum(['tip', 'ring', 'both']).default('both'),
  }),
  z.object({ kind: z.literal('move'), pair: PairNumberSchema, toPair: PairNumberSchema }),
]);
export type LeadChange = z.infer<typeof LeadChangeSchema>;

/**
 * A part made from a template (a set, an add-on, a bridging adapter): its id, its name, the id of its template
 * (see templates/), the fields of its kind, and where it is drawn.
 */
function templatePartSchema<Fields extends z.ZodRawShape>(fields: Fields) {
  return z.object({
    id: PartIdSchema,
    name: NameSchema,
    template: z.string().min(1).max(40),
    ...fields,
    position: PositionSchema.optional(),
  });
}

/** The restorer's lead changes inside one set or add-on. */
const LeadChangesSchema = z.array(LeadChangeSchema).max(50).default([]);

export const KeySetSchema = templatePartSchema({
  /** The intercom station this set is meant to answer (id of a KSU intercom station), if any. */
  station: PartIdSchema.optional(),
  /** Line numbers whose incoming ringing this set's ringer is strapped to. */
  ringerLines: z.array(z.number().int().min(1).max(30)).max(30).default([]),
  leadChanges: LeadChangesSchema,
});
export type KeySet = z.infer<typeof KeySetSchema>;

/** An add-on (e.g. the hands-free unit). */
export const AddOnSchema = templatePartSchema({
  /** The set whose private leads this add-on is meant to share. */
  serves: PartIdSchema,
  leadChanges: LeadChangesSchema,
});
export type AddOn = z.infer<typeof AddOnSchema>;

/** A bridging adapter (e.g. two jacks and one plug). */
export const AdapterSchema = templatePartSchema({
  /** Pairs the adapter parallels between its ports; all 25 when absent. */
  bridgedPairs: z.array(PairNumberSchema).max(25).optional(),
});
export type Adapter = z.infer<typeof AdapterSchema>;

export const LineSchema = z.object({
  /** Line number as shown on the key strip and in the KSU: 1..N. */
  number: z.number().int().min(1).max(30),
  label: z.string().trim().max(40).default(''),
  /** The line's own directory number at the exchange, used by the exchange simulation. */
  directoryNumber: z.string().regex(/^[0-9]{3,15}$/, 'Digits only, 3 to 15 of them'),
});
export type Line = z.infer<typeof LineSchema>;

export const StationSchema = z.object({
  id: PartIdSchema,
  /** What a user dials on the intercom to buzz this station. */
  code: z.string().regex(/^[0-9]{1,4}$/, 'One to four digits'),
  label: z.string().trim().max(40).default(''),
});
export type Station = z.infer<typeof StationSchema>;

/** What the KSU puts on one pair of one station port. */
export const KsuLeadSchema = z.discriminatedUnion('kind', [
  /** Line talk pair: tip and ring of the line. */
  z.object({ kind: z.literal('line-talk'), line: z.number().int().min(1).max(30) }),
  /** Line A-lead pair: tip = A, ring = A1 (ground). */
  z.object({ kind: z.literal('line-a'), line: z.number().int().min(1).max(30) }),
  /** Line lamp pair: tip = L, ring = LG. */
  z.object({ kind: z.literal('line-lamp'), line: z.number().int().min(1).max(30) }),
  /** Line A-lead and lamp lead on one pair: tip = A, ring = L (our own scheme for lines 6–9 of the ten-key set). */
  z.object({ kind: z.literal('line-a-lamp'), line: z.number().int().min(1).max(30) }),
  /** Intercom buzzer output for one station. */
  z.object({ kind: z.literal('buzzer'), station: PartIdSchema }),
]);
export type KsuLead = z.infer<typeof KsuLeadSchema>;

export const CrossConnectSchema = z.object({
  /** Station port number on the KSU, 1-based. */
  port: z.number().int().min(1).max(24),
  pair: PairNumberSchema,
  lead: KsuLeadSchema,
});
export type CrossConnect = z.infer<typeof CrossConnectSchema>;

export const KsuSchema = z.object({
  id: PartIdSchema,
  name: NameSchema,
  lines: z.array(LineSchema).min(1, 'A KSU needs at least one line').max(30),
  stations: z.array(StationSchema).max(40).default([]),
  /** Number of station ports (25-pair jacks) on the KSU. */
  ports: z.number().int().min(1).max(24).default(4),
  /** Pair-by-pair cross-connect of the station ports. When absent the standard station plan is used. */
  crossConnect: z.array(CrossConnectSchema).max(600).optional(),
  position: PositionSchema.optional(),
});
export type Ksu = z.infer<typeof KsuSchema>;

export const PortRefSchema = z.object({ part: PartIdSchema, port: z.string().min(1).max(40) });
export type PortRef = z.infer<typeof PortRefSchema>;

export const CableEndSchema = z.enum(['from', 'to']);
export type CableEnd = z.infer<typeof CableEndSchema>;

/**
 * A wiring fault inside a cable, made when one end was terminated (`end`: the from or the to end).
 * - split-pair: at that end the `conductor` of `pair` and the same conductor of `withPair` are exchanged, so each
 *   circuit's tip (or ring) arrives on the other pair;
 * - reversed-pair: at that end the tip and ring of `pair` are exchanged;
 * - open-conductor: the `conductor` of `pair` is broken near that end and reaches nothing beyond it.
 */
export const WiringFaultSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('split-pair'),
    pair: PairNumberSchema,
    withPair: PairNumberSchema,
    conductor: ConductorSchema,
    end: CableEndSchema,
  }),
  z.object({ kind: z.literal('reversed-pair'), pair: PairNumberSchema, end: CableEndSchema }),
  z.object({
    kind: z.literal('open-conductor'),
    pair: PairNumberSchema,
    conductor: ConductorSchema,
    end: CableEndSchema,
  }),
]);
export type WiringFault = z.infer<typeof WiringFaultSchema>;
export type WiringFaultKind = WiringFault['kind'];

/** One 25-pair cable from a plug to a jack: pin for pin, unless it has wiring faults. */
export const CableSchema = z.object({
  id: PartIdSchema,
  from: PortRefSchema,
  to: PortRefSchema,
  label: z.string().trim().max(40).optional(),
  /** Wiring faults inside this cable (absent on a healthy cable); each pair may appear in one of them only. */
  faults: z.array(WiringFaultSchema).max(12).optional(),
});
export type Cable = z.infer<typeof CableSchema>;

/** What must keep working after a cure. */
export const RequiredFunctionsSchema = z.object({
  /** Every set can originate, answer and hold on every line its key strip and the KSU both have. */
  allLinesOnEverySet: z.boolean().default(true),
  /** An intercom call to a station buzzes the set assigned to it. */
  intercomPerStation: z.boolean().default(true),
  /** Sets whose hands-free add-on must keep working. */
  handsFreeSets: z.array(PartIdSchema).max(200).default([]),
});
export type RequiredFunctions = z.infer<typeof RequiredFunctionsSchema>;

export const PlanSchema = z.object({
  version: z.literal(PLAN_VERSION),
  name: NameSchema,
  description: z.string().max(2000).default(''),
  ksu: KsuSchema,
  sets: z.array(KeySetSchema).max(200).default([]),
  addOns: z.array(AddOnSchema).max(200).default([]),
  adapters: z.array(AdapterSchema).max(200).default([]),
  cables: z.array(CableSchema).max(600).default([]),
  required: RequiredFunctionsSchema.default({
    allLinesOnEverySet: true,
    intercomPerStation: true,
    handsFreeSets: [],
  }),
});

export type Plan = z.infer<typeof PlanSchema>;
export type PlanInput = z.input<typeof PlanSchema>;
