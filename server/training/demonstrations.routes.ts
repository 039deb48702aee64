/** Demonstrations: instructors keep their own (admins see all); class members open the ones assigned to them. */
import { Router, type Response } from 'express';
import { z } from 'zod';
import { SaveDemonstrationSchema } from '../../shared/schemas/training.schema';
import { currentUser, requireUser } from '../http/auth.middleware';
import { notFound } from '../http/http-error';
import { parseBody, parseParams } from '../http/validate';
import type { ClassesRepo } from './classes.repo';
import { managedOr404, staffOnly } from './classes.routes';
import type { PuzzlesRepo } from './puzzles.repo';

const IdParams = z.object({ id: z.string().min(1).max(64) });

export function demonstrationsRoutes({ classes, puzzles }: { classes: ClassesRepo; puzzles: PuzzlesRepo }): Router {
  const router = Router();
  const staff = staffOnly;

  async function managed(res: Response, id: string) {
    const { ownerId: _owner, ...record } = await managedOr404(res, puzzles.findDemonstration(id), 'That demonstration');
    return record;
  }

  router.get('/demonstrations', staff, async (_req, res) => {
    const user = currentUser(res);
    res.json({ items: await puzzles.listDemonstrations(user.role === 'admin' ? undefined : user.id) });
  });

  router.post('/demonstrations', staff, async (req, res) => {
    const { spec } = parseBody(SaveDemonstrationSchema, req);
    const id = await puzzles.saveDemonstration(currentUser(res).id, spec);
    res.status(201).json(await managed(res, id));
  });

  router.get('/demonstrations/:id', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    res.json(await managed(res, id));
  });

  router.put('/demonstrations/:id', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const { spec } = parseBody(SaveDemonstrationSchema, req);
    const before = await managed(res, id);
    await puzzles.saveDemonstration(currentUser(res).id, spec, before.id);
    res.json(await managed(res, id));
  });

  router.delete('/demonstrations/:id', staff, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    await managed(res, id);
    await puzzles.removeDemonstration(id);
    res.status(204).end();
  });

  router.get('/assignments/:id/demonstration', requireUser, async (req, res) => {
    const { id } = parseParams(IdParams, req);
    const assignment = await classes.assignment(id);
    if (!assignment || assignment.kind !== 'demonstration' || !(await classes.isMember(assignment.classId, currentUser(res).id)))
      throw notFound('That demonstration');
    const found = (await puzzles.findDemonstration(assignment.itemId))!;
    const { ownerId: _owner, ...record } = found;
    res.json(record);
  });

  return router;
}
