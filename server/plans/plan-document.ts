/**
 * Checks a plan document before it is stored with the engine's own `validatePlan` (schema plus
 * cross-references: templates, parts, ports, stations, lines) and the server's size bound. Problems come back
 * as `details` keyed by path: under "document" in dotted form for API bodies ("document.sets.1.template"), and
 * in the engine's own form for imported files ("sets[1].template"), as the command line prints them.
 */
import { crossReferenceIssues, validatePlan, type Plan, type PlanIssue } from '../../shared/engine/index';
import { HttpError } from '../http/http-error';
import { issuesByPath, problemsMessage } from '../http/validate';

/** The engine writes "sets[1].template"; the API's details use "sets.1.template". */
const dotted = (enginePath: string): string =>
  ['document', enginePath.replace(/\[(\d+)\]/g, '.$1')].filter(Boolean).join('.');

function sizeIssues(plan: Plan, maxSets: number): PlanIssue[] {
  if (plan.sets.length <= maxSets) return [];
  return [{ path: 'sets', message: `A plan may hold at most ${maxSets} sets; this one has ${plan.sets.length}` }];
}

function issuesOf(input: unknown, maxSets: number): readonly PlanIssue[] | Plan {
  const result = validatePlan(input);
  if (!result.ok) return result.issues;
  const tooBig = sizeIssues(result.plan, maxSets);
  return tooBig.length ? tooBig : result.plan;
}

/** A document of unknown shape (a stored revision, a copy): schema, references and size. */
export function checkPlanDocument(input: unknown, maxSets = Infinity): Plan {
  const checked = issuesOf(input, maxSets);
  if (Array.isArray(checked)) throw planProblems(checked);
  return checked as Plan;
}

/** The cross-references and size of a document the shared request schema has already parsed. */
export function checkPlanReferences(plan: Plan, maxSets = Infinity): Plan {
  const issues = [...crossReferenceIssues(plan), ...sizeIssues(plan, maxSets)];
  if (issues.length) throw planProblems(issues);
  return plan;
}

function planProblems(issues: readonly PlanIssue[]): HttpError {
  const problems = issuesByPath(issues.map((i) => ({ path: dotted(i.path), message: i.message })));
  const message = problemsMessage('The plan has problems that must be fixed before saving.', problems);
  return new HttpError(400, 'VALIDATION_FAILED', message, problems.details, problems.problemCount);
}

/** An uploaded plan file: JSON first, then the same checks; the message names the first place and problem. */
export function checkPlanFile(text: string, maxSets: number): Plan {
  let input: unknown;
  try {
    input = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (err) {
    const why = err instanceof Error ? err.message : 'unreadable';
    throw new HttpError(400, 'BAD_JSON', `The file is not a plan file: it is not valid JSON (${why}).`);
  }
  const checked = issuesOf(input, maxSets);
  if (!Array.isArray(checked)) return checked as Plan;
  const problems = issuesByPath(checked.map((i) => ({ path: i.path || '(file)', message: i.message })));
  const [first] = checked;
  const more = checked.length > 1 ? ` (and ${checked.length - 1} more)` : '';
  throw new HttpError(
    400,
    'VALIDATION_FAILED',
    `The file was not imported. ${first.path || 'The file'}: ${first.message}${more}.`,
    problems.details,
    problems.problemCount,
  );
}
