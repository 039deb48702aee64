/**
 * Demo training data: the demo instructor's class with the demo trainee in it, four library puzzles in the
 * instructor's collection (three assigned, with due dates), a demonstration of the demo installation, and a
 * healthy copy of that installation (its cure made) in the instructor's plans for the puzzle maker.
 */
import type { Knex } from 'knex';
import {
  applyAction,
  applyCure,
  cure,
  evaluate,
  initialState,
  type Plan,
  type SimAction,
} from '../../shared/engine/index';
import type { DemonstrationStep } from '../../shared/training/demonstration.schema';
import { SHIPPED_PUZZLES } from '../../shared/training/index';
import { loadDemoPlan } from '../plans/demo-plan';
import { plansRepo } from '../plans/plans.repo';
import { classesRepo } from './classes.repo';
import { puzzlesRepo } from './puzzles.repo';
import { usersRepo } from '../users/users.repo';

export const DEMO_CLASS_NAME = 'Evening restoration course';
export const DEMO_PUZZLE_SLUGS = ['dark-lamp-front-desk', 'two-dial-tones', 'bakehouse-buzzer', 'back-office-two-faults'];
export const DEMO_DEMONSTRATION_TITLE = 'Why the bindery hears two dial tones';
/** The instructor's healthy plan: the demo installation with its cure applied, to plant puzzle faults in. */
export const DEMO_HEALTHY_PLAN_NAME = 'Bindery after the cure';

/** The demo installation with the cure's lead changes made, or null when the cure finds none to make. */
export function healthyDemoPlan(plan: Plan): Plan | null {
  const result = cure(plan);
  if (!result.ok || !result.changes.length) return null;
  return {
    ...applyCure(plan, result),
    name: DEMO_HEALTHY_PLAN_NAME,
    description: 'The demo installation with its cure made: no fault in any state, a base for fault puzzles.',
  };
}

const DAY = 24 * 3600_000;

/** A due date as an instructor sets one: that day at 17:00 (the server's local time), not at the minute of seeding. */
function endOfClassDay(at: number): string {
  const d = new Date(at);
  d.setHours(17, 0, 0, 0);
  return d.toISOString();
}

/** One recorded step: the actions from idle, the state they reach, and the first finding there when revealed. */
function step(plan: Plan, actions: SimAction[], narration: string, reveal: boolean): DemonstrationStep {
  const state = actions.reduce((s, a) => applyAction(plan, s, a), initialState(plan));
  const finding = reveal ? evaluate(plan, state).findings[0] : undefined;
  return {
    actions,
    state,
    narration,
    reveal: finding
      ? { code: finding.code, sets: finding.sets, lines: finding.lines, stations: finding.stations }
      : null,
  };
}

export function demoDemonstration(plan: Plan) {
  const [a, b] = plan.sets;
  const first: SimAction[] = [
    { kind: 'press-key', set: a.id, key: 1 },
    { kind: 'lift-handset', set: a.id },
  ];
  const both: SimAction[] = [...first, { kind: 'press-key', set: b.id, key: 2 }, { kind: 'lift-handset', set: b.id }];
  return {
    title: DEMO_DEMONSTRATION_TITLE,
    plan,
    steps: [
      step(plan, [], 'The bindery at rest: two six-key sets on one cable, every lamp dark.', false),
      step(plan, first, `${a.name} takes line 1: one dial tone, line 1 lit on both sets.`, false),
      step(plan, both, `${b.name} takes line 2 and hears two dial tones. Where does the second one come from?`, false),
      step(plan, both, 'The common talk pairs of both sets meet in the adapter: the cause, traced lead by lead.', true),
      step(plan, [{ kind: 'intercom-call', station: plan.ksu.stations[0].id }], 'An intercom call to 21 buzzes both sets.', true),
    ],
  };
}

export async function seedTraining(knex: Knex): Promise<void> {
  const users = usersRepo(knex);
  const instructor = await users.findByEmail('instructor@leadbench.test');
  const trainee = await users.findByEmail('trainee@leadbench.test');
  if (!instructor || !trainee) return;
  const classes = classesRepo(knex);
  const puzzles = puzzlesRepo(knex);
  const classId = await classes.create(instructor.id, DEMO_CLASS_NAME);
  await classes.addMember(classId, trainee.id);
  const now = Date.now();
  for (const [i, slug] of DEMO_PUZZLE_SLUGS.entries()) {
    const shipped = SHIPPED_PUZZLES.find((p) => p.slug === slug)!;
    const { slug: _slug, ...spec } = shipped;
    const puzzleId = await puzzles.createPuzzle(instructor.id, spec, slug);
    if (i < 3)
      await classes.createAssignment({
        classId,
        kind: 'puzzle',
        itemId: puzzleId,
        dueAt: endOfClassDay(now + (i + 1) * 7 * DAY),
      });
  }
  let plan: Plan;
  try {
    plan = loadDemoPlan();
  } catch {
    return; // the demo plan file is missing: the class and puzzles stay, without the demonstration
  }
  const demonstrationId = await puzzles.saveDemonstration(instructor.id, demoDemonstration(plan));
  await classes.createAssignment({ classId, kind: 'demonstration', itemId: demonstrationId, dueAt: null });
  const healthy = healthyDemoPlan(plan);
  if (healthy) await plansRepo(knex).create(instructor.id, healthy);
}
