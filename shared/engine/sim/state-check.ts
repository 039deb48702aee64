/**
 * A state document checked against a plan: either a full SimState, or a list of actions applied in order from the
 * initial state. Set ids, lines, stations and key indexes are checked, each issue with its exact path
 * ("[0].set", "sets.desk.pressedKey"). The sim command line reads its --state file with this.
 */
import { z } from 'zod';
import { zodIssues, type Issue } from '../document/issues';
import { findSet } from '../document/parts';
import type { Plan } from '../document/plan.schema';
import { getNetlist } from '../model/netlist';
import { getTemplate } from '../templates/part-templates';
import { applyActions, initialState, normaliseState } from './actions';
import { SimActionSchema, SimStateSchema, type SimAction, type SimState } from './state.schema';

export type StateIssue = Issue;

export type ReadStateResult =
  { ok: true; state: SimState; actions: SimAction[] | null } | { ok: false; issues: StateIssue[] };

function actionIssues(plan: Plan, action: SimAction, at: string): StateIssue[] {
  const issues: StateIssue[] = [];
  const lines = new Set(plan.ksu.lines.map((l) => l.number));
  if ('set' in action) {
    const set = findSet(plan, action.set);
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
    const set = findSet(plan, id);
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

/** Reads a state document (undefined: the initial state). */
export function readState(plan: Plan, input: unknown): ReadStateResult {
  if (input === undefined) return { ok: true, state: initialState(plan), actions: null };
  if (Array.isArray(input)) {
    const parsed = z.array(SimActionSchema).safeParse(input);
    if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
    const issues = parsed.data.flatMap((a, i) => actionIssues(plan, a, `[${i}]`));
    if (issues.length > 0) return { ok: false, issues };
    return { ok: true, state: applyActions(plan, initialState(plan), parsed.data), actions: parsed.data };
  }
  const parsed = SimStateSchema.safeParse(input);
  if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) };
  const issues = stateIssues(plan, parsed.data);
  if (issues.length > 0) return { ok: false, issues };
  return { ok: true, state: normaliseState(plan, parsed.data), actions: null };
}

/** Why an action cannot apply to this plan, in plain words, or null when it can. applyAction ignores such actions. */
export function actionProblem(plan: Plan, action: SimAction): string | null {
  const nl = getNetlist(plan);
  if ('set' in action) {
    const info = nl.setById.get(action.set);
    if (!info) return `There is no key set "${action.set}" in this plan.`;
    if (action.kind === 'press-key' && !(info.keyLine[action.key] > 0) && action.key !== info.holdKey) {
      return `${info.name} has no key ${action.key}.`;
    }
    if (action.kind === 'press-hold' && !info.holdKey) return `${info.name} has no hold key.`;
    if (action.kind === 'hands-free' && !info.addOns.length) return `${info.name} has no hands-free add-on.`;
  }
  if ('line' in action && !nl.lines.some((l) => l.number === action.line)) {
    return `The KSU has no line ${action.line}.`;
  }
  if (action.kind === 'intercom-call' && !nl.stations.some((s) => s.id === action.station)) {
    return `The KSU has no intercom station "${action.station}".`;
  }
  return null;
}
