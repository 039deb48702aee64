/**
 * What a trainee's browser receives about a run: the set layout, what the sets show now, the far ends and the
 * log. Built from the puzzle with its faults planted, so the sightings are real, but nothing of the plan itself,
 * the faults, the repair or the findings is copied into it.
 */
import { getTemplate, type Plan, type SimAction, type SimState } from '../../shared/engine/index';
import type { Assignment, Layout, RunView } from '../../shared/schemas/training.schema';
import { plantFaults, sightingOf, type PuzzleSpec } from '../../shared/training/index';
import type { RunRecord } from './puzzles.repo';

const faultyCache = new WeakMap<PuzzleSpec, Plan>();

/** The installation as the trainee finds it. */
export function faultyPlan(spec: PuzzleSpec): Plan {
  let plan = faultyCache.get(spec);
  if (!plan) {
    const planted = plantFaults(spec.plan, spec.faults);
    // Puzzles are checked before they are saved, so a fault that does not fit is a broken invariant.
    if (!planted.ok) throw new Error(`Stored puzzle does not plant: ${planted.problem}`);
    plan = planted.plan;
    faultyCache.set(spec, plan);
  }
  return plan;
}

export function layoutOf(plan: Plan): Layout {
  return {
    sets: plan.sets.map((s) => ({
      id: s.id,
      name: s.name,
      keys: (getTemplate(s.template)?.keys ?? []).map((k) => ({ index: k.index, label: k.label, kind: k.kind })),
      handsFree: plan.addOns.some((a) => a.serves === s.id),
    })),
    lines: plan.ksu.lines.map((l) => ({ number: l.number, label: l.label })),
    stations: plan.ksu.stations.map((s) => ({ id: s.id, code: s.code, label: s.label })),
    cords: plan.cables.flatMap((c) => {
      const set = plan.sets.find((s) => s.id === c.from.part);
      return set ? [{ id: c.id, label: `${set.name}'s cord` }] : [];
    }),
    ksuPorts: plan.ksu.ports,
  };
}

/** A key for "a state tried": the mechanical positions and calls, not the exchange's digits. */
export function stateKey(state: SimState): string {
  return JSON.stringify({
    sets: Object.entries(state.sets).sort(([a], [b]) => a.localeCompare(b)),
    lines: state.lines.map((l) => [l.line, l.circuit, l.ringing, l.far.phase]),
    intercom: state.intercom.calling,
  });
}

export function describeAction(plan: Plan, action: SimAction): string {
  const set = 'set' in action ? (plan.sets.find((s) => s.id === action.set)?.name ?? action.set) : '';
  switch (action.kind) {
    case 'lift-handset':
      return `${set}: lifted the handset`;
    case 'hang-up':
      return `${set}: hung up`;
    case 'press-key': {
      const key = getTemplate(plan.sets.find((s) => s.id === action.set)?.template ?? '')?.keys?.find((k) => k.index === action.key);
      return `${set}: pressed key ${key?.label ?? action.key}`;
    }
    case 'press-hold':
      return `${set}: pressed hold`;
    case 'release-keys':
      return `${set}: released the keys`;
    case 'hands-free':
      return `${set}: hands-free ${action.on ? 'on' : 'off'}`;
    case 'dial':
      return `${set}: dialled ${action.digits}`;
    case 'pause':
      return 'Waited';
    case 'ring-line':
      return `Far end rang line ${action.line}`;
    case 'stop-ringing':
      return `Far end stopped ringing line ${action.line}`;
    case 'far-answer':
      return `Far end answered on line ${action.line}`;
    case 'far-hang-up':
      return `Far end hung up on line ${action.line}`;
    case 'intercom-call': {
      const station = plan.ksu.stations.find((s) => s.id === action.station);
      return `Intercom call to ${station?.code ?? action.station}`;
    }
    case 'intercom-end':
      return 'Intercom call ended';
  }
}

export function runView(spec: PuzzleSpec, assignment: Assignment, run: RunRecord): RunView {
  const plan = faultyPlan(spec);
  const sighting = sightingOf(plan, run.state);
  return {
    id: run.id,
    assignmentId: assignment.id,
    puzzle: { title: spec.title, statement: spec.statement, level: spec.level, attemptLimit: spec.attemptLimit },
    dueAt: assignment.dueAt,
    layout: layoutOf(plan),
    // sightingOf copies only what a person at the set perceives, field by field.
    sets: sighting.sets,
    farEnds: run.state.lines.map((l) => ({
      line: l.line,
      ringing: l.ringing,
      answered: l.far.phase === 'answered',
    })),
    intercomCalling: run.state.intercom.calling,
    log: run.log,
    statesTried: run.seen.length,
    attemptsUsed: run.attempts,
    status: run.status,
    bestScore: run.bestScore,
    lastResult: run.lastResult,
    startedAt: run.startedAt,
  };
}
