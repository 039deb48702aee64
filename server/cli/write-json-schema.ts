/**
 * Writes shared/engine/plan.schema.json: the plan document as JSON Schema, generated from PlanSchema
 * so editors and other tools can validate plan files without running our code.
 * Run with `npm run schema`; the output is committed. `--check` exits 1 when the committed file is stale.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { PlanSchema } from '../../shared/engine/documents';

export const PLAN_SCHEMA_PATH = fileURLToPath(
  new URL('../../shared/engine/plan.schema.json', import.meta.url),
);

/** The JSON Schema text, deterministic so the committed file only changes when PlanSchema does. */
export function planJsonSchemaText(): string {
  // 'input': a plan file may leave out every field that has a default, exactly as validatePlan accepts it.
  const schema = z.toJSONSchema(PlanSchema, { io: 'input', target: 'draft-2020-12' });
  const withHeader = {
    $schema: schema.$schema,
    $id: 'https://leadbench.invalid/schemas/plan.schema.json',
    title: 'Leadbench plan document',
    description: 'One key telephone installation: KSU, key sets, add-ons, bridging adapters and cables.',
    ...schema,
  };
  return `${JSON.stringify(withHeader, null, 2)}\n`;
}

function main(argv: string[]): number {
  const text = planJsonSchemaText();
  if (argv.includes('--check')) {
    let current: string;
    try {
      current = readFileSync(PLAN_SCHEMA_PATH, 'utf8');
    } catch {
      current = '';
    }
    if (current !== text) {
      process.stderr.write(`${PLAN_SCHEMA_PATH} is out of date: run npm run schema\n`);
      return 1;
    }
    return 0;
  }
  writeFileSync(PLAN_SCHEMA_PATH, text);
  process.stdout.write(`wrote ${PLAN_SCHEMA_PATH}\n`);
  return 0;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  process.exitCode = main(process.argv.slice(2));
}
