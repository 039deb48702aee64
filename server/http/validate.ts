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

/** An error reply lists at most this many problems, so a body full of mistakes gets a short answer. */
export const MAX_PROBLEMS_LISTED = 50;

export interface Problems {
  details: Record<string, string[]>;
  /** Set only when more problems exist than `details` lists. */
  problemCount?: number;
}

/**
 * Turns issues into `{ "dotted.path": [messages] }` (issues without a path go under ""), keeping the
 * first MAX_PROBLEMS_LISTED paths and the total count.
 */
export function issuesByPath(
  issues: readonly { path: readonly PropertyKey[] | string; message: string }[],
): Problems {
  const details: Record<string, string[]> = {};
  let listed = 0;
  for (const issue of issues) {
    const key = typeof issue.path === 'string' ? issue.path : issue.path.map(String).join('.');
    if (!(key in details)) {
      if (listed === MAX_PROBLEMS_LISTED) return { details, problemCount: issues.length };
      details[key] = [];
      listed += 1;
    }
    if (details[key].length < 5) details[key].push(issue.message);
  }
  return { details };
}

/** Message for a validation reply: the usual sentence, with the count when the list is cut short. */
export const problemsMessage = (message: string, problems: Problems): string =>
  problems.problemCount === undefined
    ? message
    : `${message} ${problems.problemCount} problems were found; the first ${MAX_PROBLEMS_LISTED} are listed.`;
