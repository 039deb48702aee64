/** Everything under /api/training: classes and invitations, puzzles and runs, demonstrations, gradebook. */
import { Router } from 'express';
import type { Logger } from 'pino';
import type { SessionService } from '../auth/sessions';
import type { Database } from '../db/database';
import type { Mailer } from '../mail/mailer';
import { usersRepo } from '../users/users.repo';
import { classesRepo } from './classes.repo';
import { classesRoutes } from './classes.routes';
import { demonstrationsRoutes } from './demonstrations.routes';
import { gradebookRoutes } from './gradebook.routes';
import { puzzlesRepo } from './puzzles.repo';
import { puzzlesRoutes } from './puzzles.routes';

export interface TrainingDeps {
  db: Database;
  mailer: Mailer;
  sessions: SessionService;
  logger: Logger;
  publicOrigin: string;
}

export function trainingRoutes({ db, mailer, sessions, logger, publicOrigin }: TrainingDeps): Router {
  const classes = classesRepo(db);
  const puzzles = puzzlesRepo(db);
  const users = usersRepo(db);
  const router = Router();
  router.use(classesRoutes({ classes, puzzles, users, mailer, sessions, logger, publicOrigin }));
  router.use(puzzlesRoutes({ classes, puzzles }));
  router.use(demonstrationsRoutes({ classes, puzzles }));
  router.use(gradebookRoutes({ classes, puzzles }));
  return router;
}
