/**
 * Request validation: parse with a shared schema and hand back the typed value.
 * A ZodError thrown here becomes 400 VALIDATION_FAILED in the error handler.
 */
import type { Request } from 'express';
import type { z } from 'zod';

export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  return schema.parse(req.body ?? {});
}

export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  return schema.parse(req.query);
}

export function parseParams<S extends z.ZodType>(schema: S, req: Request): z.output<S> {
  return schema.parse(req.params);
}

/** Turns zod issues into `{ "dotted.path": [messages] }`; issues without a path go under "". */
export function issuesByPath(
  issues: readonly { path: PropertyKey[]; message: string }[],
): Record<string, string[]> {
  const details: Record<string, string[]> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.');
    (details[key] ??= []).push(issue.message);
  }
  return details;
}
