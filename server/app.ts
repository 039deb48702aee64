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
import { accountRoutes } from './account/account.routes';
import { adminRoutes } from './admin/admin.routes';
import { auditRepo } from './admin/audit.repo';
import { authRoutes } from './auth/auth.routes';
import { authService } from './auth/auth.service';
import { sessionService } from './auth/sessions';
import { sessionsRepo } from './auth/sessions.repo';
import { signInThrottle } from './auth/sign-in-throttle';
import { tokensRepo } from './auth/tokens.repo';
import { loadSession } from './http/auth.middleware';
import type { Config } from './config';
import type { Database } from './db/database';
import { healthRoutes } from './health.routes';
import { apiNotFound, errorHandler, sendError } from './http/error-handler';
import { originCheck } from './http/origin-check';
import { requestLog } from './http/request-log';
import { accountWriteLimit } from './http/rate-limit';
import type { Mailer } from './mail/mailer';
import { plansLibraryRoutes } from './plans/plans-library';
import { plansRepo } from './plans/plans.repo';
import { trainingRoutes } from './training/training.routes';
import { usersRepo } from './users/users.repo';

/** Big enough for a plan with hundreds of parts and their positions. */
export const JSON_LIMIT = '1mb';

const PERMISSIONS_POLICY = [
  'camera=()',
  'microphone=()',
  'geolocation=()',
  'payment=()',
  'usb=()',
  'serial=()',
  'bluetooth=()',
  'interest-cohort=()',
].join(', ');

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
  const users = usersRepo(db);
  const plans = plansRepo(db);
  const sessions = sessionService(sessionsRepo(db), users, {
    absoluteHours: config.sessionAbsoluteHours,
    idleHours: config.sessionIdleHours,
    secure: config.sessionSecure,
  });
  const auth = authService({
    users,
    plans,
    tokens: tokensRepo(db),
    throttle: signInThrottle(db, config.signInThrottle),
    mailer,
    logger: log,
    publicOrigin: config.publicOrigin,
    emailVerification: config.emailVerification,
  });
  const audit = auditRepo(db);

  const app = express();
  app.disable('x-powered-by');
  // API answers are Cache-Control: no-store, so nobody revalidates them; hashing each body for an ETag is
  // wasted work. Static files keep theirs (express.static sets its own).
  app.set('etag', false);
  app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'", "'wasm-unsafe-eval'"],
          // naive-ui renders its component styles at run time (CSS-in-JS into <style> tags), which
          // needs inline styles; scripts stay 'self' (plus compiling the cure solver's WebAssembly).
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
  app.use((_req, res, next) => {
    // Powerful browser features the app never uses stay off, for it and anything it embeds.
    res.setHeader('Permissions-Policy', PERMISSIONS_POLICY);
    next();
  });
  app.use(requestLog(log));

  const api = express.Router();
  api.use(express.json({ limit: JSON_LIMIT }));
  api.use(loadSession(sessions));
  api.use(originCheck(config.publicOrigin));
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use('/health', healthRoutes(db));
  api.use('/auth', authRoutes(auth, sessions, config.authRateLimit));
  api.use('/account', accountRoutes({ auth, sessions, users, plans }));
  api.use('/admin', adminRoutes({ users, audit, auth, sessions }));
  api.use('/plans', accountWriteLimit(config.planWritesPerMinute));
  api.use(plansLibraryRoutes({ db, config, mailer, logger: log }));
  api.use(
    '/training',
    trainingRoutes({ db, mailer, sessions, logger: log, publicOrigin: config.publicOrigin }),
  );
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

  // Outside /api only GET serves pages; other methods get the API's error shape, not an HTML page.
  app.use((req, res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD') return next();
    sendError(res, 404, 'NOT_FOUND', `There is no route ${req.method} ${req.path}.`);
  });

  app.use(errorHandler);
  return app;
}
