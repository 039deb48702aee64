/**
 * Saved plans. Every route needs a signed-in user. Reading (plan, revisions, export, copy) is open to the owner
 * and to people the plan is shared with; changing it only to the owner. A plan one may not see answers 404.
 */
import { Router } from 'express';
import { z } from 'zod';
import { diffPlans } from '../../shared/plans/plan-diff';
import {
  RestoreRevisionSchema,
  RevisionCompareQuerySchema,
  RevisionParamsSchema,
  type PlanCompare,
  type PlanRevisionList,
} from '../../shared/schemas/plan-revisions.schema';
import {
  PlanCreateSchema,
  PlanDuplicateSchema,
  PlanListQuerySchema,
  PlanRenameSchema,
  PlanUpdateSchema,
  type PlanList,
  type PlanRecord,
} from '../../shared/schemas/plans.schema';
import { currentUser, requireUser } from '../http/auth.middleware';
import { notFound } from '../http/http-error';
import { singleUpload } from '../http/upload';
import { parseBody, parseParams, parseQuery } from '../http/validate';
import { fileNameOf } from './file-name';
import { checkPlanDocument, checkPlanFile, checkPlanReferences } from './plan-document';
import type { PlansRepo } from './plans.repo';
import { viewerOf, type PlansService } from './plans.service';

export const PlanIdParams = z.object({ id: z.string().min(1).max(64) });

export function plansRoutes(
  service: PlansService,
  plans: PlansRepo,
  importMaxBytes: number,
  maxSets: number,
): Router {
  const router = Router();
  router.use(requireUser);

  router.get('/', async (req, res) => {
    const query = parseQuery(PlanListQuerySchema, req);
    const user = currentUser(res);
    await service.purgeExpired();
    const [{ items, total }, usage] = await Promise.all([
      plans.list(viewerOf(user), query),
      service.usage(user.id),
    ]);
    const body: PlanList = { items, total, page: query.page, pageSize: query.pageSize, usage };
    res.json(body);
  });

  router.post('/', async (req, res) => {
    const { document } = parseBody(PlanCreateSchema, req);
    const plan: PlanRecord = await service.create(currentUser(res), checkPlanReferences(document, maxSets));
    res.status(201).location(`/api/plans/${plan.id}`).json(plan);
  });

  router.post('/import', singleUpload('file', importMaxBytes, 'a plan file'), async (req, res) => {
    const document = checkPlanFile(req.file!.buffer.toString('utf8'), maxSets);
    const plan = await service.create(currentUser(res), document, 'import');
    res.status(201).location(`/api/plans/${plan.id}`).json(plan);
  });

  router.get('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const record = await plans.visibleRecordJson(id, viewerOf(currentUser(res)));
    if (!record) throw notFound('That plan');
    res.type('json').send(record);
  });

  router.put('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { document, baseUpdatedAt } = parseBody(PlanUpdateSchema, req);
    res.json(await service.save(id, currentUser(res), checkPlanReferences(document, maxSets), baseUpdatedAt));
  });

  router.patch('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { name, baseUpdatedAt } = parseBody(PlanRenameSchema, req);
    const user = currentUser(res);
    const row = await service.owned(id, user);
    const document = { ...(JSON.parse(row.document) as object), name };
    res.json(await service.save(id, user, checkPlanDocument(document, maxSets), baseUpdatedAt));
  });

  router.delete('/:id', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    await service.remove(id, currentUser(res));
    res.status(204).end();
  });

  router.post('/:id/undelete', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    res.json(await service.undelete(id, currentUser(res)));
  });

  router.post('/:id/duplicate', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { name } = parseBody(PlanDuplicateSchema, req);
    const user = currentUser(res);
    const { row } = await service.visible(id, user);
    const original = checkPlanDocument(JSON.parse(row.document), maxSets);
    const copyName = name ?? `Copy of ${original.name}`.slice(0, 60);
    const plan = await service.create(user, { ...original, name: copyName }, 'copy');
    res.status(201).location(`/api/plans/${plan.id}`).json(plan);
  });

  router.get('/:id/export', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { row } = await service.visible(id, currentUser(res));
    const document = JSON.parse(row.document) as { name: string };
    res.attachment(fileNameOf(document.name, '.json'));
    res.type('application/json').send(`${JSON.stringify(document, null, 2)}\n`);
  });

  router.get('/:id/revisions', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    await service.visible(id, currentUser(res));
    const body: PlanRevisionList = { items: await plans.listRevisions(id) };
    res.json(body);
  });

  router.get('/:id/revisions/compare', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { from, to } = parseQuery(RevisionCompareQuerySchema, req);
    await service.visible(id, currentUser(res));
    const [a, b] = await Promise.all([plans.getRevision(id, from), plans.getRevision(id, to)]);
    if (!a || !b) throw notFound('That revision');
    const body: PlanCompare = { from, to, changes: diffPlans(a.document, b.document) };
    res.json(body);
  });

  router.get('/:id/revisions/:rev', async (req, res) => {
    const { id, rev } = parseParams(RevisionParamsSchema, req);
    await service.visible(id, currentUser(res));
    const revision = await plans.getRevision(id, rev);
    if (!revision) throw notFound('That revision');
    res.json(revision);
  });

  router.post('/:id/revisions/:rev/restore', async (req, res) => {
    const { id, rev } = parseParams(RevisionParamsSchema, req);
    const { baseUpdatedAt } = parseBody(RestoreRevisionSchema, req);
    const user = currentUser(res);
    await service.owned(id, user);
    const revision = await plans.getRevision(id, rev);
    if (!revision) throw notFound('That revision');
    const document = checkPlanDocument(revision.document, maxSets);
    res.json(await service.save(id, user, document, baseUpdatedAt, { reason: 'restore', restoredFrom: rev }));
  });

  return router;
}
