/** The example plans shipped in shared/engine/examples, read and validated as a user's file would be. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { validatePlan, type Plan } from '../../shared/engine/index';

export const EXAMPLES_DIR = join(
  fileURLToPath(new URL('.', import.meta.url)),
  '../../shared/engine/examples',
);

export function examplePlan(file: string): Plan {
  const r = validatePlan(JSON.parse(readFileSync(join(EXAMPLES_DIR, file), 'utf8')));
  if (!r.ok) throw new Error(`${file}: ${JSON.stringify(r.issues)}`);
  return r.plan;
}
