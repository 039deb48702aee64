/**
 * The invented demonstration installation every demo account (and every new account) starts with.
 * It lives with the engine's examples; read at run time so a missing file is a clear message, not a crash.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Plan } from '../../shared/engine/documents';
import { checkPlanDocument } from './plan-document';

export const DEMO_PLAN_FILE = fileURLToPath(
  new URL('../../shared/engine/examples/demo-plan.json', import.meta.url),
);

export class DemoPlanUnavailable extends Error {}

let cached: Plan | undefined;

export function loadDemoPlan(): Plan {
  if (cached) return cached;
  let text: string;
  try {
    text = readFileSync(DEMO_PLAN_FILE, 'utf8');
  } catch {
    throw new DemoPlanUnavailable(`The demo plan is missing: expected ${DEMO_PLAN_FILE}.`);
  }
  try {
    cached = checkPlanDocument(JSON.parse(text));
  } catch (err) {
    const why = err instanceof Error ? err.message : String(err);
    const details = (err as { details?: unknown }).details;
    throw new DemoPlanUnavailable(
      `The demo plan at ${DEMO_PLAN_FILE} is not a valid plan: ${why}${details ? ` ${JSON.stringify(details)}` : ''}`,
    );
  }
  return cached;
}
