/**
 * Photos of a part's wiring, under /api/plans/:id/photos. Everyone who may see the plan may see its photos
 * (never through a static folder); only the owner adds, re-captions or deletes them.
 */
import { Router, type RequestHandler } from 'express';
import {
  PhotoListQuerySchema,
  PhotoParamsSchema,
  PhotoUpdateSchema,
  PhotoUploadFieldsSchema,
  type PlanPhotoList,
} from '../../shared/schemas/plan-photos.schema';
import type { Plan } from '../../shared/engine/index';
import { currentUser, requireUser } from '../http/auth.middleware';
import { HttpError, notFound } from '../http/http-error';
import { singleUpload } from '../http/upload';
import { parseBody, parseParams, parseQuery } from '../http/validate';
import { PlanIdParams } from './plans.routes';
import type { PlansService } from './plans.service';
import type { PhotoStore } from './photo-store';
import { toPhoto, type PhotosRepo } from './photos.repo';

const partIds = (plan: Plan) => [
  plan.ksu.id,
  ...[...plan.sets, ...plan.addOns, ...plan.adapters].map((p) => p.id),
];

export function photosRoutes(
  service: PlansService,
  photos: PhotosRepo,
  store: PhotoStore,
  maxBytes: number,
): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser);

  /** Owner check before the upload is read, so nobody else's file is ever buffered. */
  const ownerFirst: RequestHandler = async (req, res, next) => {
    const { id } = parseParams(PlanIdParams, req);
    res.locals.planRow = await service.owned(id, currentUser(res));
    next();
  };

  router.get('/', async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { part } = parseQuery(PhotoListQuerySchema, req);
    await service.visible(id, currentUser(res));
    const body: PlanPhotoList = { items: (await photos.list(id, part)).map(toPhoto) };
    res.json(body);
  });

  router.post('/', ownerFirst, singleUpload('file', maxBytes, 'a photo'), async (req, res) => {
    const { id } = parseParams(PlanIdParams, req);
    const { partId, caption } = parseBody(PhotoUploadFieldsSchema, req);
    const user = currentUser(res);
    const plan = JSON.parse((res.locals.planRow as { document: string }).document) as Plan;
    if (!partIds(plan).includes(partId))
      throw new HttpError(400, 'VALIDATION_FAILED', 'That part is not in this plan.', {
        partId: [`No part "${partId}" in the plan`],
      });
    const usage = await service.usage(user.id);
    if (usage.bytes + req.file!.size > usage.maxBytes)
      throw new HttpError(
        409,
        'CONFLICT',
        'Your plans and photos would take more room than your account may keep.',
      );
    const saved = await store.save(req.file!.buffer);
    const row = await photos.insert({
      plan_id: id,
      part_id: partId,
      caption,
      file_name: saved.fileName,
      thumb_name: saved.thumbName,
      mime: saved.mime,
      width: saved.width,
      height: saved.height,
      byte_size: saved.byteSize,
      uploaded_by: user.id,
    });
    res.status(201).json(toPhoto(row));
  });

  for (const variant of ['image', 'thumb'] as const) {
    router.get(`/:photoId/${variant}`, async (req, res) => {
      const { id, photoId } = parseParams(PhotoParamsSchema, req);
      await service.visible(id, currentUser(res));
      const row = await photos.find(id, photoId);
      if (!row) throw notFound('That photo');
      res.type(variant === 'image' ? row.mime : 'image/webp');
      res.setHeader('Cache-Control', 'private, no-store');
      res.setHeader('Content-Disposition', 'inline');
      res.sendFile(store.path(variant === 'image' ? row.file_name : row.thumb_name), (err) => {
        if (err && !res.headersSent)
          res.status(404).json({ error: { code: 'NOT_FOUND', message: 'That photo was not found.' } });
      });
    });
  }

  router.patch('/:photoId', async (req, res) => {
    const { id, photoId } = parseParams(PhotoParamsSchema, req);
    const { caption } = parseBody(PhotoUpdateSchema, req);
    await service.owned(id, currentUser(res));
    const row = await photos.setCaption(id, photoId, caption);
    if (!row) throw notFound('That photo');
    res.json(toPhoto(row));
  });

  router.delete('/:photoId', async (req, res) => {
    const { id, photoId } = parseParams(PhotoParamsSchema, req);
    await service.owned(id, currentUser(res));
    const row = await photos.find(id, photoId);
    if (!row) throw notFound('That photo');
    await photos.remove(id, photoId);
    await store.remove([row.file_name, row.thumb_name]);
    res.status(204).end();
  });

  return router;
}
