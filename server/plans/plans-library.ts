/** The plans library's routes in one place: plans, their revisions, files, shares, photos and work record, and share links. */
import { Router } from 'express';
import type { Logger } from 'pino';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';
import { photoStore } from './photo-store';
import { photosRepo } from './photos.repo';
import { photosRoutes } from './photos.routes';
import { sharesRepo } from './shares.repo';
import { linkRoutes, planSharesRoutes } from './shares.routes';
import { plansRepo } from './plans.repo';
import { plansRoutes } from './plans.routes';
import { plansService, type PlanLimits } from './plans.service';
import { workRecordRepo } from './work-record.repo';
import { workRecordRoutes } from './work-record.routes';

export interface PlansLibraryDeps {
  db: Database;
  /** The parts of the server's settings the library uses. */
  config: { plans: PlanLimits; photos: { maxBytes: number; dir: string }; publicOrigin: string };
  mailer: Mailer;
  logger: Logger;
}

/** Mount at the API root: answers under /plans and /links. */
export function plansLibraryRoutes({ db, config, mailer, logger }: PlansLibraryDeps): Router {
  const plans = plansRepo(db);
  const photos = photosRepo(db);
  const shares = sharesRepo(db);
  const store = photoStore(config.photos.dir);
  const service = plansService({ plans, photos, store, limits: config.plans, logger });

  const router = Router();
  router.use(
    '/plans/:id/shares',
    planSharesRoutes({ service, shares, mailer, logger, publicOrigin: config.publicOrigin }),
  );
  router.use('/plans/:id/photos', photosRoutes(service, photos, store, config.photos.maxBytes));
  router.use('/plans/:id', workRecordRoutes(service, workRecordRepo(db)));
  router.use('/plans', plansRoutes(service, plans, config.plans.importMaxBytes, config.plans.maxSets));
  router.use('/links', linkRoutes({ service, shares }));
  return router;
}
