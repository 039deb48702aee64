/** Fault puzzles, demonstrations and trainees' runs: the only place that reads or writes those tables. */
import type { SimState } from '../../shared/engine/index';
import type {
  DemonstrationRecord,
  DemonstrationSummary,
  GradeResultView,
  PuzzleRecord,
  PuzzleSummary,
} from '../../shared/schemas/training.schema';
import type { DemonstrationSpec } from '../../shared/training/demonstration.schema';
import type { PuzzleSpec } from '../../shared/training/puzzle.schema';
import type { Database } from '../db/database';
import { newId } from '../users/users.repo';

interface PuzzleRow {
  id: string;
  owner_id: string;
  title: string;
  level: number;
  spec: string;
  library_slug: string | null;
  created_at: string;
  owner_name: string;
}

interface DemonstrationRow {
  id: string;
  owner_id: string;
  title: string;
  spec: string;
  created_at: string;
  updated_at: string;
  owner_name: string;
}

export interface RunRecord {
  id: string;
  assignmentId: string;
  userId: string;
  state: SimState;
  log: { at: string; text: string }[];
  seen: string[];
  attempts: number;
  status: 'working' | 'passed' | 'failed';
  bestScore: number | null;
  lastResult: GradeResultView | null;
  elapsedMs: number | null;
  startedAt: string;
  finishedAt: string | null;
}

interface RunRow {
  id: string;
  assignment_id: string;
  user_id: string;
  state: string;
  log: string;
  seen: string;
  attempts: number;
  status: RunRecord['status'];
  best_score: number | null;
  last_result: string | null;
  elapsed_ms: number | null;
  started_at: string;
  finished_at: string | null;
}

const toPuzzle = (row: PuzzleRow): PuzzleRecord & { ownerId: string } => {
  const spec = JSON.parse(row.spec) as PuzzleSpec;
  return {
    id: row.id,
    ownerId: row.owner_id,
    title: row.title,
    level: row.level as 1 | 2 | 3,
    attemptLimit: spec.attemptLimit,
    faultCount: spec.faults.length,
    ownerName: row.owner_name,
    librarySlug: row.library_slug,
    createdAt: row.created_at,
    spec,
  };
};

const toDemonstration = (row: DemonstrationRow): DemonstrationRecord & { ownerId: string } => {
  const spec = JSON.parse(row.spec) as DemonstrationSpec;
  return {
    id: row.id,
    ownerId: row.owner_id,
    title: row.title,
    stepCount: spec.steps.length,
    ownerName: row.owner_name,
    updatedAt: row.updated_at,
    spec,
  };
};

const toRun = (row: RunRow): RunRecord => ({
  id: row.id,
  assignmentId: row.assignment_id,
  userId: row.user_id,
  state: JSON.parse(row.state) as SimState,
  log: JSON.parse(row.log) as RunRecord['log'],
  seen: JSON.parse(row.seen) as string[],
  attempts: row.attempts,
  status: row.status,
  bestScore: row.best_score,
  lastResult: row.last_result ? (JSON.parse(row.last_result) as GradeResultView) : null,
  elapsedMs: row.elapsed_ms,
  startedAt: row.started_at,
  finishedAt: row.finished_at,
});

export function puzzlesRepo(db: Database) {
  const puzzles = () =>
    db('training_puzzles as p').join('users as u', 'u.id', 'p.owner_id').select('p.*', 'u.display_name as owner_name');
  const demonstrations = () =>
    db('training_demonstrations as d')
      .join('users as u', 'u.id', 'd.owner_id')
      .select('d.*', 'u.display_name as owner_name');

  return {
    async listPuzzles(ownerId?: string): Promise<PuzzleSummary[]> {
      const rows = (await puzzles()
        .modify((qb) => {
          if (ownerId) qb.where('p.owner_id', ownerId);
        })
        .orderBy([{ column: 'p.level' }, { column: 'p.title' }, { column: 'p.id' }])) as PuzzleRow[];
      return rows.map((r) => {
        const { spec: _spec, ownerId: _owner, ...summary } = toPuzzle(r);
        return summary;
      });
    },

    async findPuzzle(id: string): Promise<(PuzzleRecord & { ownerId: string }) | null> {
      const row = (await puzzles().where('p.id', id).first()) as PuzzleRow | undefined;
      return row ? toPuzzle(row) : null;
    },

    async createPuzzle(ownerId: string, spec: PuzzleSpec, librarySlug: string | null = null): Promise<string> {
      const id = newId();
      await db('training_puzzles').insert({
        id,
        owner_id: ownerId,
        title: spec.title,
        level: spec.level,
        spec: JSON.stringify(spec),
        library_slug: librarySlug,
        created_at: new Date().toISOString(),
      });
      return id;
    },

    async removePuzzle(id: string): Promise<void> {
      await db('training_puzzles').where({ id }).delete();
    },

    async listDemonstrations(ownerId?: string): Promise<DemonstrationSummary[]> {
      const rows = (await demonstrations()
        .modify((qb) => {
          if (ownerId) qb.where('d.owner_id', ownerId);
        })
        .orderBy([{ column: 'd.updated_at', order: 'desc' }, { column: 'd.id' }])) as DemonstrationRow[];
      return rows.map((r) => {
        const { spec: _spec, ownerId: _owner, ...summary } = toDemonstration(r);
        return summary;
      });
    },

    async findDemonstration(id: string): Promise<(DemonstrationRecord & { ownerId: string }) | null> {
      const row = (await demonstrations().where('d.id', id).first()) as DemonstrationRow | undefined;
      return row ? toDemonstration(row) : null;
    },

    async saveDemonstration(ownerId: string, spec: DemonstrationSpec, id?: string): Promise<string> {
      const now = new Date().toISOString();
      if (id) {
        await db('training_demonstrations').where({ id }).update({ title: spec.title, spec: JSON.stringify(spec), updated_at: now });
        return id;
      }
      const created = newId();
      await db('training_demonstrations').insert({
        id: created,
        owner_id: ownerId,
        title: spec.title,
        spec: JSON.stringify(spec),
        created_at: now,
        updated_at: now,
      });
      return created;
    },

    async removeDemonstration(id: string): Promise<void> {
      await db('training_demonstrations').where({ id }).delete();
    },

    async findRun(id: string): Promise<RunRecord | null> {
      const row = await db<RunRow>('training_runs').where({ id }).first();
      return row ? toRun(row) : null;
    },

    async runFor(assignmentId: string, userId: string): Promise<RunRecord | null> {
      const row = await db<RunRow>('training_runs').where({ assignment_id: assignmentId, user_id: userId }).first();
      return row ? toRun(row) : null;
    },

    async runsOf(filter: { userId?: string; assignmentIds?: string[] }): Promise<RunRecord[]> {
      const rows = await db<RunRow>('training_runs').modify((qb) => {
        if (filter.userId) qb.where('user_id', filter.userId);
        if (filter.assignmentIds) qb.whereIn('assignment_id', filter.assignmentIds);
      });
      return rows.map(toRun);
    },

    async createRun(assignmentId: string, userId: string, state: SimState, seen: string[]): Promise<RunRecord> {
      const row: RunRow = {
        id: newId(),
        assignment_id: assignmentId,
        user_id: userId,
        state: JSON.stringify(state),
        log: '[]',
        seen: JSON.stringify(seen),
        attempts: 0,
        status: 'working',
        best_score: null,
        last_result: null,
        elapsed_ms: null,
        started_at: new Date().toISOString(),
        finished_at: null,
      };
      await db('training_runs').insert(row).onConflict(['assignment_id', 'user_id']).ignore();
      return (await this.runFor(assignmentId, userId))!;
    },

    async saveRun(run: RunRecord): Promise<void> {
      await db('training_runs')
        .where({ id: run.id })
        .update({
          state: JSON.stringify(run.state),
          log: JSON.stringify(run.log),
          seen: JSON.stringify(run.seen),
          attempts: run.attempts,
          status: run.status,
          best_score: run.bestScore,
          last_result: run.lastResult ? JSON.stringify(run.lastResult) : null,
          elapsed_ms: run.elapsedMs,
          finished_at: run.finishedAt,
        });
    },
  };
}

export type PuzzlesRepo = ReturnType<typeof puzzlesRepo>;
