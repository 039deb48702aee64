/**
 * Checks a plan document before it is stored with the engine's own `validatePlan` (schema plus
 * cross-references: templates, parts, ports, stations, lines) and the server's size bound. Problems come back
 * as `details` keyed by path: under "document" in dotted form for API bodies ("document.sets.1.template"), and
 * in the engine's own form for imported files ("sets[1].template"), as the command line prints them.
 */
import { validatePlan, type Plan } from '../../shared/engine/index';
import { HttpError } from '../http/http-error';

/** The engine writes "sets[1].template"; the API's details use "sets.1.template". */
const dotted = (enginePath: string): string =>
  ['document', enginePath.replace(/\[(\d+)\]/g, '.$1')].filter(Boolean).join('.');

function issuesOf(input: unknown, maxSets: number): { path: string; message: string }[] | Plan {
  const result = validatePlan(input);
  if (!result.ok) return result.issues;
  if (result.plan.sets.length > maxSets)
    return [
      {
        path: 'sets',
        message: `A plan may hold at most ${maxSets} sets; this one has ${result.plan.sets.length}`,
      },
    ];
  return result.plan;
}

export function checkPlanDocument(input: unknown, maxSets = Infinity): Plan {
  const checked = issuesOf(input, maxSets);
  if (!Array.isArray(checked)) return checked;
  const details: Record<string, string[]> = {};
  for (const issue of checked) (details[dotted(issue.path)] ??= []).push(issue.message);
  throw new HttpError(
    400,
    'VALIDATION_FAILED',
    'The plan has problems that must be fixed before saving.',
    details,
  );
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
  if (!Array.isArray(checked)) return checked;
  const details: Record<string, string[]> = {};
  for (const issue of checked) (details[issue.path || '(file)'] ??= []).push(issue.message);
  const [first] = checked;
  const more = checked.length > 1 ? ` (and ${checked.length - 1} more)` : '';
  throw new HttpError(
    400,
    'VALIDATION_FAILED',
    `The file was not imported. ${first.path || 'The file'}: ${first.message}${more}.`,
    details,
  );
}
