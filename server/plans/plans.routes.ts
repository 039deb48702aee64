/** Saved plans of the signed-in user. Another user's plan answers 404, as if it did not exist. */
import { Router } from 'express';
import { z } from 'zod';
import {
  PlanCreateSchema,
  PlanUpdateSchema,
  type PlanList,
  type PlanRecord,
} from '../../shared/schemas/plans.schema';
import { currentUser, requireUser } from '../http/auth.middleware';
import { HttpError, notFound } from '../http/http-error';
import { parseBody, parseParams } from '../http/validate';
import { checkPlanReferences } from './plan-document';
import type { PlansRepo } from './plans.repo';

const PlanIdParams = z.object({ id: z.string().min(1).max(64) });

export function plansRoutes(plans: PlansRepo): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (_req, res) => {
    const body: PlanList = { items: await plans.listForOwner(currentUser(res).id) };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const { document } = parseBody(PlanCreateSchema, req);
    const plan: PlanRecord = await plans.create(currentUser(res).id, checkPlanReferences(document));
    res.status(201).location(`/api/plans/${plan.id}`).json(plan);
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const plan = await plans.findForOwner(id, currentUser(res).id);
    if (!plan) throw notFound('That plan');
    res.json(plan);
  });

  router.put('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { document, baseUpdatedAt } = parseBody(PlanUpdateSchema, req);
    const outcome = await plans.update(id, currentUser(res).id, checkPlanReferences(document), baseUpdatedAt);
    if (outcome.status === 'missing') throw notFound('That plan');
    if (outcome.status === 'stale') {
      throw new HttpError(
        409,
        'CONFLICT',
        'This plan was saved elsewhere since you opened it. Reload it first.',
      );
    }
    res.json(outcome.plan);
  });

  router.delete('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    if (!(await plans.delete(id, currentUser(res).id))) throw notFound('That plan');
    res.status(204).end();
  });

  return router;
}
