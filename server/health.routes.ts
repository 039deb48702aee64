/** Liveness for people and monitors: version and whether the database answers. */
import { readFileSync } from 'node:fs';
import { Router } from 'express';
import type { Health } from '../shared/schemas/error.schema';
import type { Database } from './db/database';

const VERSION = (
  JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string }
).version;

export function healthRoutes(db: Database): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    let database: Health['database'] = 'ok';
    try {
      await db.raw('select 1');
    } catch {
      database = 'unavailable';
    }
    const body: Health = { status: database === 'ok' ? 'ok' : 'degraded', version: VERSION, database };
    res.status(database === 'ok' ? 200 : 503).json(body);
  });
  return router;
}
