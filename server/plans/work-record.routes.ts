/**
 * The work record and the PDF work sheet, under /api/plans/:id. Everyone who may see the plan may read them; only
 * the owner keeps the as-found record or ticks steps off (the server stamps the date). Anyone else gets 404.
 */
import { Router } from 'express';
import type { Plan } from '../../shared/engine/index';
import {
  WorkEntryParamsSchema,
  WorkEntryUpdateSchema,
  type WorkRecord,
} from '../../shared/schemas/work-record.schema';
import { asFound } from '../../shared/work-sheet/as-found';
import { currentUser, requireUser } from '../http/auth.middleware';
import { parseBody, parseParams } from '../http/validate';
import { fileNameOf } from './file-name';
import { PlanIdParams } from './plans.routes';
import type { PlansService } from './plans.service';
import type { WorkRecordRepo } from './work-record.repo';
import { workSheetPdf } from './work-sheet-pdf';

/** The columns of a plan row these routes read. */
type PlanRow = { id: string; document: string };

const documentOf = (row: PlanRow) => JSON.parse(row.document) as Plan;

export function workRecordRoutes(service: PlansService, records: WorkRecordRepo): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  async function recordOf(row: PlanRow): Promise<WorkRecord> {
    const [kept, entries] = await Promise.all([records.asFound(row.id), records.entries(row.id)]);
    return {
      planId: row.id,
      recordedAt: kept?.recordedAt ?? null,
      asFound: kept?.parts ?? asFound(documentOf(row)),
      entries,
    };
  }

  router.get('/work-record', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { row } = await service.visible(id, currentUser(res));
    res.json(await recordOf(row));
  });

  /** Keeps the plan's leads as wired now; a record already kept stays as it was. */
  router.post('/work-record/as-found', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const user = currentUser(res);
    const row = await service.owned(id, user);
    await records.keepAsFound(id, asFound(documentOf(row)), user.id);
    res.status(201).json(await recordOf(row));
  });

  router.put('/work-record/entries/:key', async (req, res) => {
    const { id, key } = parseParams(WorkEntryParamsSchema, req);
    const input = parseBody(WorkEntryUpdateSchema, req);
    const user = currentUser(res);
    const row = await service.owned(id, user);
    // Work has begun: the leads as found are kept first, so they can always be put back.
    await records.keepAsFound(id, asFound(documentOf(row)), user.id);
    res.json(await records.saveEntry(id, key, input, user.id));
  });

  router.get('/work-sheet.pdf', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { row } = await service.visible(id, currentUser(res));
    const record = await recordOf(row);
    const pdf = await workSheetPdf({ plan: documentOf(row), ...record });
    res.type('application/pdf');
    res.setHeader(
      'Content-Disposition',
      `inline; filename="${fileNameOf(documentOf(row).name, '-work-sheet.pdf')}"`,
    );
    res.send(pdf);
  });

  return router;
}
