/**
 * Command line for the circuit engine:
 *
 *   npm run -s sim -- <plan.json> [--state <state.json>] [--sweep] [--cure]
 *
 * Prints one JSON object on stdout (format: shared/engine/examples/README.md).
 * Exit status: 0 no findings, 1 findings, 2 invalid input (message with the exact path on stderr).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import {
  cure,
  evaluate,
  readState,
  sweep,
  validatePlan,
  type CureResult,
  type Evaluation,
  type Plan,
  type SimState,
  type SweepResult,
} from '../../shared/engine';

export const EXIT_CLEAN = 0;
export const EXIT_FINDINGS = 1;
export const EXIT_INVALID = 2;

const USAGE = 'usage: npm run -s sim -- <plan.json> [--state <state.json>] [--sweep] [--cure]';

/** Bad input: reported on stderr with exit status 2, never as a stack trace. */
class InputError extends Error {}

function readJson(file: string, what: string): unknown {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? 'unreadable';
    throw new InputError(`${file}: cannot read the ${what} file (${code})`);
  }
  try {
    return JSON.parse(text) as unknown;
  } catch (err) {
    throw new InputError(`${file}: the ${what} file is not valid JSON (${(err as Error).message})`);
  }
}

function loadPlan(file: string): Plan {
  const checked = validatePlan(readJson(file, 'plan'));
  if (!checked.ok) {
    const lines = checked.issues.map((issue) => `${file}: ${issue.path || '(root)'}: ${issue.message}`);
    throw new InputError(lines.join('\n'));
  }
  return checked.plan;
}

export interface SimOutput {
  plan: string;
  state: SimState;
  evaluation: Evaluation;
  sweep?: SweepResult;
  cure?: CureResult;
}

/** Runs the command and returns the exit status; all output goes through the two writers. */
export function run(argv: string[], out: (text: string) => void, err: (text: string) => void): number {
  try {
    let parsed;
    try {
      parsed = parseArgs({
        args: argv,
        allowPositionals: true,
        options: {
          state: { type: 'string' },
          sweep: { type: 'boolean', default: false },
          cure: { type: 'boolean', default: false },
        },
      });
    } catch (e) {
      throw new InputError(`${(e as Error).message}\n${USAGE}`);
    }
    const { values, positionals } = parsed;
    if (positionals.length !== 1) throw new InputError(USAGE);
    const planFile = positionals[0];
    const plan = loadPlan(planFile);

    const stateResult =
      values.state === undefined
        ? readState(plan, undefined)
        : readState(plan, readJson(values.state, 'state'));
    if (!stateResult.ok) {
      throw new InputError(
        stateResult.issues.map((i) => `${values.state}: ${i.path || '(root)'}: ${i.message}`).join('\n'),
      );
    }

    const evaluation = evaluate(plan, stateResult.state);
    const output: SimOutput = { plan: plan.name, state: stateResult.state, evaluation };
    let findingCount = evaluation.findings.length;
    if (values.sweep) {
      output.sweep = sweep(plan);
      findingCount += output.sweep.findings.length;
    }
    if (values.cure) {
      output.cure = cure(plan);
      findingCount += output.cure.before.length;
    }
    out(`${JSON.stringify(output, null, 2)}\n`);
    return findingCount > 0 ? EXIT_FINDINGS : EXIT_CLEAN;
  } catch (e) {
    if (e instanceof InputError) {
      err(`${e.message}\n`);
      return EXIT_INVALID;
    }
    throw e;
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  process.exitCode = run(
    process.argv.slice(2),
    (text) => process.stdout.write(text),
    (text) => process.stderr.write(text),
  );
}
