/**
 * The --state file of the sim command: either a full SimState, or a list of actions applied in order from the
 * initial state. Both are checked against the plan (set ids, lines, stations, key indexes) with exact paths.
 */
import { z } from 'zod';
import {
  applyAction,
  getTemplate,
  initialState,
  normaliseState,
  SimActionSchema,
  SimStateSchema,
  type Plan,
  type SimAction,
  type SimState,
} from '../../shared/engine';

export interface StateIssue {
  path: string;
  message: string;
}

export type ReadStateResult =
  { ok: true; state: SimState; actions: SimAction[] | null } | { ok: false; issues: StateIssue[] };

function formatPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((out, part) => {
    if (typeof part === 'number') return `${out}[${part}]`;
    return out ? `${out}.${String(part)}` : String(part);
  }, '');
}

function zodIssues(error: z.ZodError, prefix: readonly PropertyKey[] = []): StateIssue[] {
  return error.issues.map((i) => ({ path: formatPath([...prefix, ...i.path]), message: i.message }));
}

function actionIssues(plan: Plan, action: SimAction, at: string): StateIssue[] {
  const issues: StateIssue[] = [];
  const lines = new Set(plan.ksu.lines.map((l) => l.number));
  if ('set' in action) {
    const set = plan.sets.find((s) => s.id === action.set);
    if (!set) {
      issues.push({ path: `${at}.set`, message: `No set with id "${action.set}" in the plan` });
    } else if (action.kind === 'press-key') {
      const keys = getTemplate(set.template)?.keys ?? [];
      if (!keys.some((k) => k.index === action.key)) {
        issues.push({
          path: `${at}.key`,
          message: `${set.name} has no key ${action.key} (it has ${keys.length})`,
        });
      }
    } else if (action.kind === 'hands-free' && !plan.addOns.some((a) => a.serves === set.id)) {
      issues.push({ path: `${at}.set`, message: `${set.name} has no hands-free add-on` });
    }
  }
  if ('line' in action && !lines.has(action.line)) {
    issues.push({ path: `${at}.line`, message: `The KSU has no line ${action.line}` });
  }
  if ('station' in action && !plan.ksu.stations.some((s) => s.id === action.station)) {
    issues.push({ path: `${at}.station`, message: `The KSU has no intercom station "${action.station}"` });
  }
  return issues;
}

function stateIssues(plan: Plan, state: SimState): StateIssue[] {
  const issues: StateIssue[] = [];
  for (const [id, s] of Object.entries(state.sets)) {
    const set = plan.sets.find((x) => x.id === id);
    if (!set) {
      issues.push({ path: `sets.${id}`, message: `No set with id "${id}" in the plan` });
      continue;
    }
    const keys = getTemplate(set.template)?.keys ?? [];
    if (s.pressedKey !== null && !keys.some((k) => k.kind === 'line' && k.index === s.pressedKey)) {
      issues.push({ path: `sets.${id}.pressedKey`, message: `${set.name} has no line key ${s.pressedKey}` });
    }
    if (s.handsFreeOn && !plan.addOns.some((a) => a.serves === id)) {
      issues.push({ path: `sets.${id}.handsFreeOn`, message: `${set.name} has no hands-free add-on` });
    }
  }
  const lines = new Set(plan.ksu.lines.map((l) => l.number));
  state.lines.forEach((l, i) => {
    if (!lines.has(l.line))
      issues.push({ path: `lines[${i}].line`, message: `The KSU has no line ${l.line}` });
  });
  const calling = state.intercom.calling;
  if (calling !== null && !plan.ksu.stations.some((s) => s.id === calling)) {
    issues.push({ path: 'intercom.calling', message: `The KSU has no intercom station "${calling}"` });
  }
  return issues;
}

/** Reads a --state document (undefined: the initial state). */
export function readState(plan: Plan, input: unknown): ReadStateResult {
  if (input === undefined) return { ok: true, state: initialState(plan), actions: null };
  if (Array.isArray(input)) {
    const parsed = z.array(SimActionSchema).safeParse(input);
    if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
    const issues = parsed.data.flatMap((a, i) => actionIssues(plan, a, `[${i}]`));
    if (issues.length > 0) return { ok: false, issues };
    let state = initialState(plan);
    for (const a of parsed.data) state = applyAction(plan, state, a);
    return { ok: true, state, actions: parsed.data };
  }
  const parsed = SimStateSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
  const issues = stateIssues(plan, parsed.data);
  if (issues.length > 0) return { ok: false, issues };
  return { ok: true, state: normaliseState(plan, parsed.data), actions: null };
}
