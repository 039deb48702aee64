/**
 * Working a fault puzzle through the API, and who may see what. The trade behaviour comes from the engine
 * (a lifted lamp lead leaves the lamp dark: common practice, no published source); what the trainee may see is
 * our own rule: only lamps, tones, buzzers and ringers, never the plan, its planted faults, the repair or findings.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  ExplanationSchema,
  GradebookSchema,
  ProgressSchema,
  PuzzleListSchema,
  PuzzleRecordSchema,
  RunViewSchema,
  SubmissionResultSchema,
} from '../../shared/schemas/training.schema';
import { FINDING_CODES } from '../../shared/engine/index';
import { SHIPPED_PUZZLES } from '../../shared/training/index';
import { signedInAgent, startTestServer, type TestServer } from './server.harness';

type Agent = Awaited<ReturnType<typeof signedInAgent>>;
let server: TestServer;
let instructor: Agent;
let otherInstructor: Agent;
let admin: Agent;
let trainee: Agent;
let outsider: Agent;
let classId = '';
/** Shipped puzzles worked in their own class by a second trainee: each plants a wiring fault inside a cable. */
const WIRING = ['front-desk-split-pair', 'counter-lamp-line-one', 'drawing-room-never-buzzes'];
const assignments: Record<string, string> = {};
/** Every body a trainee received from a puzzle route, as text. */
const traineeBodies: string[] = [];

async function asTrainee(agent: Agent, method: 'get' | 'post', path: string, body?: object) {
  const res = method === 'get' ? await agent.agent.get(path) : await agent.agent.post(path).send(body ?? {});
  traineeBodies.push(res.text);
  return res;
}

beforeAll(async () => {
  server = await startTestServer();
  instructor = await signedInAgent(server, 'instructor');
  otherInstructor = await signedInAgent(server, 'instructor');
  admin = await signedInAgent(server, 'admin');
  trainee = await signedInAgent(server, 'trainee');
  outsider = await signedInAgent(server, 'trainee');
  classId = (await instructor.agent.post('/api/training/classes').send({ name: 'Puzzle class' })).body.id;
  await server.db('training_members').insert({ class_id: classId, user_id: trainee.user.id, joined_at: new Date().toISOString() });
  for (const slug of ['dark-lamp-front-desk', 'back-office-two-faults']) {
    const copied = PuzzleRecordSchema.parse((await instructor.agent.post('/api/training/puzzles/from-library').send({ slug })).body);
    const res = await instructor.agent
      .post(`/api/training/classes/${classId}/assignments`)
      .send({ kind: 'puzzle', itemId: copied.id, dueAt: '2027-01-15T18:00:00.000Z' });
    expect(res.status).toBe(201);
    assignments[slug] = res.body.id;
  }
});
afterAll(async () => {
  await server.close();
});

describe('working a puzzle', () => {
  let runId = '';

  it('starts a run showing the sets, not the wiring', async () => {
    const res = await asTrainee(trainee, 'post', `/api/training/assignments/${assignments['dark-lamp-front-desk']}/run`);
    expect(res.status).toBe(200);
    const run = RunViewSchema.parse(res.body);
    runId = run.id;
    expect(run.layout.sets.map((s) => s.name)).toEqual(['Front desk', 'Drawing room']);
    expect(run.puzzle.attemptLimit).toBe(3);
    expect(run.status).toBe('working');
    // Starting again resumes the same run.
    const again = RunViewSchema.parse((await asTrainee(trainee, 'post', `/api/training/assignments/${assignments['dark-lamp-front-desk']}/run`)).body);
    expect(again.id).toBe(runId);
  });

  it('applies actions with the engine and shows the dark lamp', async () => {
    // The drawing room takes line 1: its own lamp lights; the front desk's stays dark (its lamp lead is lifted).
    await asTrainee(trainee, 'post', `/api/training/runs/${runId}/actions`, { action: { kind: 'press-key', set: 'drawing-room', key: 1 } });
    const res = await asTrainee(trainee, 'post', `/api/training/runs/${runId}/actions`, { action: { kind: 'lift-handset', set: 'drawing-room' } });
    const run = RunViewSchema.parse(res.body);
    const lamp = (set: string) => run.sets.find((s) => s.set === set)!.keys.find((k) => k.index === 1)!.lamp;
    expect(lamp('drawing-room')).toBe('steady');
    expect(lamp('front-desk')).toBe('dark');
    expect(run.sets.find((s) => s.set === 'drawing-room')!.tones).toEqual(['dial']);
    expect(run.log.map((l) => l.text)).toEqual(['Drawing room: pressed key Line 1', 'Drawing room: lifted the handset']);
    expect(run.statesTried).toBe(3);
  });

  it('refuses an action that does not fit the installation, with a message', async () => {
    const res = await asTrainee(trainee, 'post', `/api/training/runs/${runId}/actions`, { action: { kind: 'lift-handset', set: 'nobody' } });
    expect(res.status).toBe(400);
    const bad = await asTrainee(trainee, 'post', `/api/training/runs/${runId}/actions`, { action: { kind: 'explode' } });
    expect(bad.status).toBe(400);
  });

  it('keeps the explanation closed while attempts remain', async () => {
    const res = await asTrainee(trainee, 'get', `/api/training/runs/${runId}/explanation`);
    expect(res.status).toBe(403);
  });

  it('grades a wrong repair, then a right one, and opens the explanation with the conductor path', async () => {
    const wrong = await asTrainee(trainee, 'post', `/api/training/runs/${runId}/submit`, {
      diagnoses: [{ part: 'drawing-room', pair: 3, kind: 'lead-left-on' }],
      repair: [{ kind: 'lead', part: 'drawing-room', change: { kind: 'lift', pair: 9, conductor: 'tip' } }],
    });
    expect(wrong.status).toBe(200);
    const first = SubmissionResultSchema.parse(wrong.body);
    expect(first.result.passed).toBe(false);
    expect(first.run.attemptsUsed).toBe(1);
    expect(first.run.status).toBe('working');

    const right = await asTrainee(trainee, 'post', `/api/training/runs/${runId}/submit`, {
      diagnoses: [{ part: 'front-desk', pair: 3, conductor: 'tip', kind: 'lead-wrongly-lifted' }],
      repair: [{ kind: 'restore', part: 'front-desk', pair: 3 }],
    });
    const second = SubmissionResultSchema.parse(right.body);
    expect(second.result.passed).toBe(true);
    expect(second.result.faultsCleared).toBe(1);
    expect(second.result.diagnosesRight).toBe(1);
    expect(second.result.unnecessaryChanges).toBe(0);
    // Second attempt: the default rubric takes 10 points per extra attempt.
    expect(second.result.breakdown.find((l) => l.item === 'attempts')!.points).toBe(-10);
    expect(second.run.status).toBe('passed');

    const explanation = ExplanationSchema.parse((await traineeFetchExplanation(runId)).body);
    expect(explanation.faults[0]).toContain('pair 3');
    // Pair 3 is white-green in the ICEA S-80-576 colour code: tip white, ring green.
    expect(explanation.paths[0].hops.map((h) => h.colour)).toEqual(['white', 'green']);
  });

  it('turns a repair that cannot be carried out into a clear message without using an attempt', async () => {
    const start = RunViewSchema.parse((await asTrainee(trainee, 'post', `/api/training/assignments/${assignments['back-office-two-faults']}/run`)).body);
    const res = await asTrainee(trainee, 'post', `/api/training/runs/${start.id}/submit`, {
      diagnoses: [],
      repair: [{ kind: 'restore', part: 'no-such-set', pair: 3 }],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain('no-such-set');
    const after = RunViewSchema.parse((await asTrainee(trainee, 'get', `/api/training/runs/${start.id}`)).body);
    expect(after.attemptsUsed).toBe(0);
  });
});

async function traineeFetchExplanation(runId: string) {
  return asTrainee(trainee, 'get', `/api/training/runs/${runId}/explanation`);
}

describe('what reaches a trainee', () => {
  it('sees only lamps, tones and buzzers of a puzzle with a wiring fault in a cable', async () => {
    // Split tips of pairs 1 and 4 at the front desk: no dial tone on line 1 there, the lamp still lights
    // (common practice, no published source).
    const first = traineeBodies.length;
    const learner = await signedInAgent(server, 'trainee');
    const wiringClass = (await instructor.agent.post('/api/training/classes').send({ name: 'Wiring class' })).body.id;
    await server.db('training_members').insert({ class_id: wiringClass, user_id: learner.user.id, joined_at: new Date().toISOString() });
    const runs: Record<string, string> = {};
    for (const slug of WIRING) {
      const copied = PuzzleRecordSchema.parse((await instructor.agent.post('/api/training/puzzles/from-library').send({ slug })).body);
      const assigned = await instructor.agent
        .post(`/api/training/classes/${wiringClass}/assignments`)
        .send({ kind: 'puzzle', itemId: copied.id, dueAt: '2027-01-15T18:00:00.000Z' });
      runs[slug] = RunViewSchema.parse((await asTrainee(learner, 'post', `/api/training/assignments/${assigned.body.id}/run`)).body).id;
    }
    const act = (slug: string, action: object) => asTrainee(learner, 'post', `/api/training/runs/${runs[slug]}/actions`, { action });
    await act('front-desk-split-pair', { kind: 'press-key', set: 'front-desk', key: 1 });
    const front = RunViewSchema.parse((await act('front-desk-split-pair', { kind: 'lift-handset', set: 'front-desk' })).body).sets.find((s) => s.set === 'front-desk')!;
    expect(front.tones).toEqual([]);
    expect(front.keys[0].lamp).toBe('steady');
    await act('counter-lamp-line-one', { kind: 'press-key', set: 'counter', key: 1 });
    const counter = RunViewSchema.parse((await act('counter-lamp-line-one', { kind: 'lift-handset', set: 'counter' })).body).sets.find((s) => s.set === 'counter')!;
    expect(counter.keys[0].lamp).toBe('dark'); // lamp lead grounded through the shared lamp ground
    const called = RunViewSchema.parse((await act('drawing-room-never-buzzes', { kind: 'intercom-call', station: 'st-22' })).body);
    expect(called.sets.find((s) => s.set === 'drawing-room')!.buzzer).toBe(false);
    // None of these runs has opened its explanation: nothing of the faults, the repair or the symptoms' causes.
    const bodies = traineeBodies.slice(first);
    expect(bodies).toHaveLength(8);
    const forbidden = ['"faults"', 'split-pair', 'reversed-pair', 'open-conductor', '"cable-pair"', 'withPair', 'Hum on line', 'reach it reversed', '"noise"', '"notes"'];
    for (const slug of WIRING) {
      const puzzle = SHIPPED_PUZZLES.find((p) => p.slug === slug)!;
      forbidden.push(puzzle.explanation, JSON.stringify(puzzle.faults[0]), JSON.stringify(puzzle.repair[0]));
    }
    for (const body of bodies) for (const word of forbidden) expect(body).not.toContain(word);
  });

  it('never carries planted faults, the repair, the plan internals or findings before the explanation opens', async () => {
    const explanationIndex = traineeBodies.findIndex((b) => b.includes('"paths"'));
    const beforeReveal = traineeBodies.slice(0, explanationIndex === -1 ? undefined : explanationIndex);
    expect(beforeReveal.length).toBeGreaterThan(8);
    const forbidden = [
      '"faults"',
      '"kind":"restore"',
      '"kind":"cross-connect"',
      'leadChanges',
      'sets[',
      '"crossConnect"',
      '"cables"',
      '"template"',
      '"findings"',
      '"hops"',
      '"path"',
      'lead-wrongly-lifted',
      'lead-left-on',
      'cross-connect-wrong',
      ...FINDING_CODES,
    ];
    for (const slug of ['dark-lamp-front-desk', 'back-office-two-faults']) {
      const puzzle = SHIPPED_PUZZLES.find((p) => p.slug === slug)!;
      forbidden.push(puzzle.explanation, JSON.stringify(puzzle.faults[0]), JSON.stringify(puzzle.repair[0]));
    }
    for (const body of beforeReveal) for (const word of forbidden) expect(body).not.toContain(word);
  });

  it('keeps runs to their trainee and puzzles to their instructor', async () => {
    const run = await trainee.agent.post(`/api/training/assignments/${assignments['dark-lamp-front-desk']}/run`);
    for (const other of [outsider, instructor, admin]) {
      expect((await other.agent.get(`/api/training/runs/${run.body.id}`)).status).toBe(404);
      expect((await other.agent.post(`/api/training/runs/${run.body.id}/actions`).send({ action: { kind: 'pause' } })).status).toBe(404);
    }
    // Not in the class: the assignment does not exist for them.
    expect((await outsider.agent.post(`/api/training/assignments/${assignments['dark-lamp-front-desk']}/run`)).status).toBe(404);
    // Trainees cannot read puzzles at all; another instructor gets 404; admins see all.
    const mine = PuzzleListSchema.parse((await instructor.agent.get('/api/training/puzzles')).body).items;
    expect((await trainee.agent.get(`/api/training/puzzles/${mine[0].id}`)).status).toBe(403);
    expect((await trainee.agent.get('/api/training/library')).status).toBe(403);
    expect((await otherInstructor.agent.get(`/api/training/puzzles/${mine[0].id}`)).status).toBe(404);
    expect(PuzzleListSchema.parse((await otherInstructor.agent.get('/api/training/puzzles')).body).items).toEqual([]);
    expect((await admin.agent.get(`/api/training/puzzles/${mine[0].id}`)).status).toBe(200);
    // Another instructor cannot assign someone else's puzzle to a class of their own.
    const theirClass = (await otherInstructor.agent.post('/api/training/classes').send({ name: 'Theirs' })).body.id;
    const steal = await otherInstructor.agent.post(`/api/training/classes/${theirClass}/assignments`).send({ kind: 'puzzle', itemId: mine[0].id });
    expect(steal.status).toBe(400);
    // Gradebook: owner and admin only.
    expect((await otherInstructor.agent.get(`/api/training/classes/${classId}/gradebook`)).status).toBe(404);
    expect((await trainee.agent.get(`/api/training/classes/${classId}/gradebook`)).status).toBe(403);
  });
});

describe('gradebook and progress', () => {
  it('shows best score, attempts and time per trainee and puzzle, as JSON and CSV', async () => {
    const book = GradebookSchema.parse((await instructor.agent.get(`/api/training/classes/${classId}/gradebook`)).body);
    expect(book.puzzles.map((p) => p.title)).toEqual(['The lamp that never lights', 'Crossed talk and a dead buzzer']);
    const row = book.rows.find((r) => r.userId === trainee.user.id)!;
    expect(row.cells[0]).toMatchObject({ status: 'passed', attempts: 2 });
    expect(row.cells[0].bestScore).toBeGreaterThan(0);
    expect(row.cells[1]).toMatchObject({ status: 'working', attempts: 0, bestScore: null });

    const csv = await instructor.agent.get(`/api/training/classes/${classId}/gradebook.csv`);
    expect(csv.headers['content-type']).toContain('text/csv');
    expect(csv.headers['content-disposition']).toContain('gradebook-Puzzle-class.csv');
    const lines = csv.text.trim().split('\n');
    expect(lines[0]).toBe('trainee,email,puzzle,level,due,status,best_score,attempts,minutes');
    expect(lines).toHaveLength(3);
    expect(lines[1]).toContain(`Test trainee,${trainee.user.email},The lamp that never lights,1,2027-01-15T18:00:00.000Z,passed,${row.cells[0].bestScore},2,`);

    const admins = await admin.agent.get(`/api/training/classes/${classId}/gradebook`);
    expect(admins.status).toBe(200);
  });

  it("lists a trainee's own progress only", async () => {
    const mine = ProgressSchema.parse((await trainee.agent.get('/api/training/my/progress')).body);
    expect(mine.items.map((i) => [i.title, i.status])).toEqual([
      ['The lamp that never lights', 'passed'],
      ['Crossed talk and a dead buzzer', 'working'],
    ]);
    expect(ProgressSchema.parse((await outsider.agent.get('/api/training/my/progress')).body).items).toEqual([]);
  });
});

describe('instructors making puzzles', () => {
  it('refuses a puzzle whose faults show no symptom, saying why', async () => {
    const { slug: _slug, ...spec } = SHIPPED_PUZZLES[0];
    // Planting a lift on the spare pair 17 changes nothing anybody at the sets can see (templates/README.md).
    const res = await instructor.agent.post('/api/training/puzzles').send({
      spec: { ...spec, faults: [{ kind: 'lead-wrongly-lifted', part: 'front-desk', pair: 17 }], repair: [{ kind: 'restore', part: 'front-desk', pair: 17 }] },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/no symptom/);
    const ok = await instructor.agent.post('/api/training/puzzles').send({ spec });
    expect(ok.status).toBe(201);
  });
});
