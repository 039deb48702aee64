/**
 * Checks a plan document before it is stored with the engine's own `validatePlan` (schema plus
 * cross-references: templates, parts, ports, stations, lines). Problems come back as `details` keyed by
 * dotted path under "document", like every other validation answer (e.g. "document.sets.1.template").
 */
import { crossReferenceIssues, validatePlan, type Plan, type PlanIssue } from '../../shared/engine/index';
import { HttpError } from '../http/http-error';
import { issuesByPath, problemsMessage } from '../http/validate';

/** The engine writes "sets[1].template"; the API's details use "sets.1.template". */
const dotted = (enginePath: string): string =>
  ['document', enginePath.replace(/\[(\d+)\]/g, '.$1')].filter(Boolean).join('.');

export function checkPlanDocument(input: unknown): Plan {
  const result = validatePlan(input);
  if (result.ok) return result.plan;
  throw planProblems(result.issues);
}

/** The cross-references of a document the shared request schema has already parsed. */
export function checkPlanReferences(plan: Plan): Plan {
  const issues = crossReferenceIssues(plan);
  if (issues.length) throw planProblems(issues);
  return plan;
}

function planProblems(issues: readonly PlanIssue[]): HttpError {
  const problems = issuesByPath(issues.map((i) => ({ path: dotted(i.path), message: i.message })));
  const message = problemsMessage('The plan has problems that must be fixed before saving.', problems);
  return new HttpError(400, 'VALIDATION_FAILED', message, problems.details, problems.problemCount);
}
