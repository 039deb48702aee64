/** The gradebook of a class (its instructor or an admin), as JSON or CSV, and a trainee's own progress. */
import { stringify } from 'csv-stringify/sync';
import { Router, type Response } from 'express';
import { z } from 'zod';
import type { Gradebook, Progress } from '../../shared/schemas/training.schema';
import { currentUser, requireUser } from '../http/auth.middleware';
import { parseParams } from '../http/validate';
import type { ClassesRepo } from './classes.repo';
import { managedOr404, staffOnly } from './classes.routes';
import type { PuzzlesRepo } from './puzzles.repo';

const IdParams = z.object({ id: z.string().min(1).max(64) });

export function gradebookRoutes({ classes, puzzles }: { classes: ClassesRepo; puzzles: PuzzlesRepo }): Router {
  const router = Router();
  const staff = staffOnly;

  async function gradebook(res: Response, id: string): Promise<Gradebook> {
    const found = await managedOr404(res, classes.find(id), 'That class');
    const assigned = (await classes.assignments(id)).filter((a) => a.kind === 'puzzle');
    const runs = await puzzles.runsOf({ assignmentIds: assigned.map((a) => a.id) });
    const members = await classes.members(id);
    return {
      classId: id,
      className: found.name,
      puzzles: assigned,
      rows: members.map((m) => ({
        ...m,
        cells: assigned.map((a) => {
          const run = runs.find((r) => r.assignmentId === a.id && r.userId === m.userId);
          return {
            assignmentId: a.id,
            bestScore: run?.bestScore ?? null,
            attempts: run?.attempts ?? 0,
            elapsedMs: run?.elapsedMs ?? null,
            status: run?.status ?? 'not-started',
          };
        }),
      })),
    };
  }

  router.get('/classes/:id/gradebook', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    res.json(await gradebook(res, id));
  });

  router.get('/classes/:id/gradebook.csv', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const book = await gradebook(res, id);
    const records = book.rows.flatMap((row) =>
      book.puzzles.map((p, i) => {
        const cell = row.cells[i];
        return {
          trainee: row.displayName,
          email: row.email,
          puzzle: p.title,
          level: p.level ?? '',
          due: p.dueAt ?? '',
          status: cell.status,
          best_score: cell.bestScore ?? '',
          attempts: cell.attempts,
          minutes: cell.elapsedMs === null ? '' : Math.ceil(cell.elapsedMs / 60_000),
        };
      }),
    );
    const csv = stringify(records, {
      header: true,
      columns: ['trainee', 'email', 'puzzle', 'level', 'due', 'status', 'best_score', 'attempts', 'minutes'],
    });
    const name = book.className.replace(/[^A-Za-z0-9-]+/g, '-').replace(/^-|-$/g, '') || 'class';
    res.type('text/csv').attachment(`gradebook-${name}.csv`).send(csv);
  });

  router.get('/my/progress', requireUser, async (_req, res) => {
    const user = currentUser(res);
    const runs = await puzzles.runsOf({ userId: user.id });
    const items: Progress['items'] = [];
    for (const c of await classes.classesOf(user.id)) {
      for (const a of await classes.assignments(c.id)) {
        if (a.kind !== 'puzzle') continue;
        const run = runs.find((r) => r.assignmentId === a.id);
        items.push({
          className: c.name,
          assignmentId: a.id,
          title: a.title,
          level: a.level ?? 1,
          dueAt: a.dueAt,
          bestScore: run?.bestScore ?? null,
          attempts: run?.attempts ?? 0,
          elapsedMs: run?.elapsedMs ?? null,
          status: run?.status ?? 'not-started',
        });
      }
    }
    const body: Progress = { items };
    res.json(body);
  });

  return router;
}
