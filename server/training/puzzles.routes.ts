/**
 * Fault puzzles for instructors (their own; admins all), the shipped library, and trainees' runs.
 * A run belongs to one trainee: anybody else gets 404. Run answers carry only what the sets show (RunView).
 */
import { Router, type Response } from 'express';
import { z } from 'zod';
import { actionProblem, applyAction, initialState, SimActionSchema } from '../../shared/engine/index';
import {
  CopyFromLibrarySchema,
  CreatePuzzleSchema,
  SubmissionSchema,
  type Assignment,
  type ExplanationView,
} from '../../shared/schemas/training.schema';
import {
  PuzzleSpecSchema,
  SHIPPED_PUZZLES,
  checkPuzzle,
  explainPuzzle,
  gradeSubmission,
  type PuzzleSpec,
} from '../../shared/training/index';
import { currentUser, requireUser } from '../http/auth.middleware';
import { HttpError, notFound } from '../http/http-error';
import { issuesByPath, parseBody, parseParams } from '../http/validate';
import type { ClassesRepo } from './classes.repo';
import { managedOr404, staffOnly } from './classes.routes';
import type { PuzzlesRepo, RunRecord } from './puzzles.repo';
import { describeAction, faultyPlan, runView, stateKey } from './run-view';

const Id = z.string().min(1).max(64);
const IdParams = z.object({ id: Id });
const ActionBody = z.object({ action: SimActionSchema });
/** Log entries kept per run, newest last. */
const LOG_LIMIT = 200;

function checkedSpec(input: unknown): PuzzleSpec {
  const parsed = PuzzleSpecSchema.safeParse(input);
  if (!parsed.success)
    throw new HttpError(400, 'VALIDATION_FAILED', 'The puzzle is not complete.', issuesByPath(parsed.error.issues).details);
  const check = checkPuzzle(parsed.data);
  if (!check.ok)
    throw new HttpError(400, 'VALIDATION_FAILED', check.problems[0], { '': check.problems });
  return parsed.data;
}

export function puzzlesRoutes({ classes, puzzles }: { classes: ClassesRepo; puzzles: PuzzlesRepo }): Router {
  const router = Router();
  const staff = staffOnly;
  const managedPuzzle = (res: Response, id: string) => managedOr404(res, puzzles.findPuzzle(id), 'That puzzle');

  // ------------------------------------------------------------------ instructors and admins

  router.get('/library', staff, (_req, res) => {
    res.json({
      items: SHIPPED_PUZZLES.map((p) => ({
        slug: p.slug,
        title: p.title,
        level: p.level,
        statement: p.statement,
        faultCount: p.faults.length,
      })),
    });
  });

  router.post('/puzzles/from-library', staff, async (req, res) => {
    const { slug } = parseBody(CopyFromLibrarySchema, req);
    const shipped = SHIPPED_PUZZLES.find((p) => p.slug === slug);
    if (!shipped) throw notFound('That library puzzle');
    const { slug: _slug, ...spec } = shipped;
    const id = await puzzles.createPuzzle(currentUser(res).id, spec, slug);
    const { ownerId: _owner, ...record } = (await puzzles.findPuzzle(id))!;
    res.status(201).json(record);
  });

  router.get('/puzzles', staff, async (_req, res) => {
    const user = currentUser(res);
    res.json({ items: await puzzles.listPuzzles(user.role === 'admin' ? undefined : user.id) });
  });

  /** Checks a draft without saving it: the same rules as saving. */
  router.post('/puzzles/check', staff, (req, res) => {
    const { spec } = parseBody(CreatePuzzleSchema, req);
    const parsed = PuzzleSpecSchema.safeParse(spec);
    if (!parsed.success)
      throw new HttpError(400, 'VALIDATION_FAILED', 'The puzzle is not complete.', issuesByPath(parsed.error.issues).details);
    res.json(checkPuzzle(parsed.data));
  });

  router.post('/puzzles', staff, async (req, res) => {
    const { spec } = parseBody(CreatePuzzleSchema, req);
    const id = await puzzles.createPuzzle(currentUser(res).id, checkedSpec(spec));
    const { ownerId: _owner, ...record } = (await puzzles.findPuzzle(id))!;
    res.status(201).json(record);
  });

  router.get('/puzzles/:id', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const { ownerId: _owner, ...record } = await managedPuzzle(res, id);
    res.json(record);
  });

  router.delete('/puzzles/:id', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    await managedPuzzle(res, id);
    await puzzles.removePuzzle(id);
    res.status(204).end();
  });

  // ------------------------------------------------------------------ trainees' runs

  /** The assignment when the user is in its class; 404 otherwise. */
  async function assignedToMe(res: Response, assignmentId: string): Promise<Assignment> {
    const assignment = await classes.assignment(assignmentId);
    if (!assignment || !(await classes.isMember(assignment.classId, currentUser(res).id)))
      throw notFound('That assignment');
    return assignment;
  }

  async function myRun(res: Response, id: string) {
    const run = await puzzles.findRun(id);
    if (!run || run.userId !== currentUser(res).id) throw notFound('That run');
    const assignment = (await classes.assignment(run.assignmentId))!;
    const puzzle = (await puzzles.findPuzzle(assignment.itemId))!;
    return { run, assignment, spec: puzzle.spec };
  }

  router.post('/assignments/:id/run', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const assignment = await assignedToMe(res, id);
    if (assignment.kind !== 'puzzle') throw notFound('That puzzle assignment');
    const puzzle = (await puzzles.findPuzzle(assignment.itemId))!;
    const user = currentUser(res);
    const state = initialState(faultyPlan(puzzle.spec));
    const run =
      (await puzzles.runFor(id, user.id)) ?? (await puzzles.createRun(id, user.id, state, [stateKey(state)]));
    res.json(runView(puzzle.spec, assignment, run));
  });

  router.get('/runs/:id', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const { run, assignment, spec } = await myRun(res, id);
    res.json(runView(spec, assignment, run));
  });

  function record(run: RunRecord, text: string) {
    run.log = [...run.log, { at: new Date().toISOString(), text }].slice(-LOG_LIMIT);
  }

  router.post('/runs/:id/actions', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const { action } = parseBody(ActionBody, req);
    const { run, assignment, spec } = await myRun(res, id);
    const plan = faultyPlan(spec);
    const problem = actionProblem(plan, action);
    if (problem) throw new HttpError(400, 'VALIDATION_FAILED', problem, { action: [problem] });
    run.state = applyAction(plan, run.state, action);
    const key = stateKey(run.state);
    if (!run.seen.includes(key)) run.seen = [...run.seen, key];
    record(run, describeAction(plan, action));
    await puzzles.saveRun(run);
    res.json(runView(spec, assignment, run));
  });

  router.post('/runs/:id/reset', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const { run, assignment, spec } = await myRun(res, id);
    run.state = initialState(faultyPlan(spec));
    record(run, 'Put every set back to idle');
    await puzzles.saveRun(run);
    res.json(runView(spec, assignment, run));
  });

  router.post('/runs/:id/submit', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const submission = parseBody(SubmissionSchema, req);
    const { run, assignment, spec } = await myRun(res, id);
    if (run.status !== 'working')
      throw new HttpError(409, 'CONFLICT', run.status === 'passed' ? 'You already passed this puzzle.' : 'No attempts are left.');
    if (!submission.repair.length)
      throw new HttpError(400, 'VALIDATION_FAILED', 'Add at least one repair step.', { repair: ['Add at least one repair step'] });
    const elapsedMs = Date.now() - Date.parse(run.startedAt);
    const graded = gradeSubmission(spec, submission, {
      attemptNumber: run.attempts + 1,
      statesTried: run.seen.length,
      elapsedMs,
    });
    // A repair that cannot be carried out on this installation is bad input, not a used attempt.
    if (!graded.ok) throw new HttpError(400, 'VALIDATION_FAILED', graded.problem, { repair: [graded.problem] });
    const result = graded.result;
    run.attempts += 1;
    run.lastResult = result;
    if (run.bestScore === null || result.score > run.bestScore) {
      run.bestScore = result.score;
      run.elapsedMs = elapsedMs;
    }
    if (result.passed) run.status = 'passed';
    else if (run.attempts >= spec.attemptLimit) run.status = 'failed';
    if (run.status !== 'working') run.finishedAt = new Date().toISOString();
    record(run, `Attempt ${run.attempts}: ${result.passed ? 'passed' : 'not yet'} (${result.score} of ${result.maxScore})`);
    await puzzles.saveRun(run);
    res.json({ result, run: runView(spec, assignment, run) });
  });

  router.get('/runs/:id/explanation', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const { run, spec } = await myRun(res, id);
    if (run.status === 'working')
      throw new HttpError(403, 'FORBIDDEN', 'The explanation opens after a pass or your last attempt.');
    const body: ExplanationView = explainPuzzle(spec);
    res.json(body);
  });

  return router;
}
