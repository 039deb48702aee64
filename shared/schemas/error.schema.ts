/** The one error body every API route answers with. */
import { z } from 'zod';

export const ERROR_CODES = [
  'VALIDATION_FAILED',
  'UNAUTHENTICATED',
  'FORBIDDEN',
  'NOT_FOUND',
  'CONFLICT',
  'EMAIL_TAKEN',
  'BAD_CREDENTIALS',
  'RATE_LIMITED',
  'BAD_ORIGIN',
  'PAYLOAD_TOO_LARGE',
  'BAD_JSON',
  'BAD_BODY',
  'EMAIL_NOT_VERIFIED',
  'ACCOUNT_DISABLED',
  'SECOND_FACTOR_REQUIRED',
  'PASSWORD_CHANGE_REQUIRED',
  'BAD_TOKEN',
  'INTERNAL',
] as const;
export const ErrorCodeSchema = z.enum(ERROR_CODES);
export type ErrorCode = z.infer<typeof ErrorCodeSchema>;

/** The code an HTTP status stands for when nothing more specific is known (server and client alike). */
export const ERROR_CODE_BY_STATUS: Readonly<Record<number, ErrorCode>> = {
  400: 'VALIDATION_FAILED',
  401: 'UNAUTHENTICATED',
  403: 'FORBIDDEN',
  404: 'NOT_FOUND',
  409: 'CONFLICT',
  413: 'PAYLOAD_TOO_LARGE',
  429: 'RATE_LIMITED',
};

export const ErrorBodySchema = z.object({
  error: z.object({
    code: ErrorCodeSchema,
    message: z.string(),
    /** Field-level messages keyed by dotted path (e.g. "password", "ksu.lines.0.number"). */
    details: z.record(z.string(), z.array(z.string())).optional(),
    /** How many problems there were in all, when `details` lists only the first of them. */
    problemCount: z.number().int().optional(),
  }),
});
export type ErrorBody = z.infer<typeof ErrorBodySchema>;

export const HealthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  version: z.string(),
  database: z.enum(['ok', 'unavailable']),
});
export type Health = z.infer<typeof HealthSchema>;
