/**
 * The Express application, built from its parts so tests can make one per database.
 * Order: security headers → request log → body → session → origin check → API routes → 404 → client → errors.
 */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pino, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { adminRoutes } from './admin/admin.routes';
import { loadSession } from './auth/auth.middleware';
import { authRoutes } from './auth/auth.routes';
import { authService } from './auth/auth.service';
import { createLucia } from './auth/lucia';
import type { Config } from './config';
import type { Database } from './db/database';
import { healthRoutes } from './health.routes';
import { apiNotFound, errorHandler } from './http/error-handler';
import { originCheck } from './http/origin-check';
import type { Mailer } from './mail/mailer';
import { plansRoutes } from './plans/plans.routes';
import { plansRepo } from './plans/plans.repo';
import { trainingRoutes } from './training/training.routes';
import { usersRepo } from './users/users.repo';

/** Big enough for a plan with hundreds of parts and their positions. */
export const JSON_LIMIT = '1mb';

export const DEFAULT_CLIENT_DIR = fileURLToPath(new URL('../dist', import.meta.url));

export interface AppDeps {
  db: Database;
  config: Config;
  mailer: Mailer;
  logger?: Logger;
  /** Folder of the built client; served with a history fallback when it holds index.html. */
  clientDir?: string;
}

export function createApp({ db, config, mailer, logger, clientDir = DEFAULT_CLIENT_DIR }: AppDeps): Express {
  const log = logger ?? pino({ level: config.logLevel });
  const lucia = createLucia(db, config);
  const users = usersRepo(db);
  const plans = plansRepo(db);
  const auth = authService({ users, plans, mailer, logger: log, publicOrigin: config.publicOrigin });

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // naive-ui renders its component styles at run time (CSS-in-JS into <style> tags), which
          // needs inline styles; scripts stay 'self' only.
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'"],
          imgSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          // The engine runs sweeps and cures in a module worker; Vite may hand it over as a blob URL.
          workerSrc: ["'self'", 'blob:'],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          upgradeInsecureRequests: config.sessionSecure ? [] : null,
        },
      },
      // Plain-http local use must not be pinned to https.
      strictTransportSecurity: config.sessionSecure,
    }),
  );
  app.use(
    pinoHttp({
      logger: log,
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      // Method, path and status only: headers would put session cookies into the log.
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({
          id: req.id,
          method: req.method,
          url: req.url,
        }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: JSON_LIMIT }));
  api.use(loadSession(lucia));
  api.use(originCheck(config.publicOrigin));
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use('/health', healthRoutes(db));
  api.use('/auth', authRoutes(auth, lucia, config.authRateLimit));
  api.use('/admin', adminRoutes(users));
  api.use('/plans', plansRoutes(plans));
  api.use('/training', trainingRoutes({ db, mailer, lucia, logger: log, publicOrigin: config.publicOrigin }));
  api.use(apiNotFound);
  app.use('/api', api);

  const indexHtml = join(clientDir, 'index.html');
  if (existsSync(indexHtml)) {
    // Vite names built assets by content hash, so they never change under the same name.
    app.use('/assets', express.static(join(clientDir, 'assets'), { immutable: true, maxAge: '1y' }));
    // A missing chunk (an old tab after a new build) must not get the HTML page as JavaScript.
    app.use('/assets', (_req, res) => {
      res.status(404).type('text/plain').send('Not found');
    });
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // History fallback: the client router owns every other GET path.
    app.get('/{*path}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(indexHtml);
    });
  }

  app.use(errorHandler);
  return app;
}
