/** Edges of the HTTP layer: damaged bodies, non-API methods, browser feature policy. */
import { gzipSync } from 'node:zlib';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { startTestServer, type TestServer } from './server.harness';

let server: TestServer;
beforeAll(async () => {
  const dir = join((await import('node:os')).tmpdir(), `leadbench-client-${Date.now()}`);
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, 'index.html'), '<!doctype html><title>shell</title>');
  server = await startTestServer({}, { clientDir: dir });
});
afterAll(async () => {
  await server.close();
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;

describe('request bodies (ASVS 4.0.3 V5.1.1, V13.1.x)', () => {
  it.each(['gzip', 'deflate', 'br'])('answers a damaged %s body with 400 BAD_BODY', async (encoding) => {
    const damaged = Buffer.from(gzipSync(Buffer.from('{"email":"a@b.c"}'))).subarray(0, 12);
    damaged[3] ^= 0xff;
    const res = await request(server.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', encoding)
      .send(damaged);
    expect(res.status).toBe(400);
    expect(errorOf(res.body).code).toBe('BAD_BODY');
  });
});

describe('routes outside /api', () => {
  it.each(['post', 'put', 'delete'] as const)(
    'answers %s with the JSON error shape, not a page',
    async (method) => {
      const res = await request(server.app)[method]('/plans/abc');
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/application\/json/);
      expect(errorOf(res.body).code).toBe('NOT_FOUND');
    },
  );
});

describe('headers (ASVS 4.0.3 V14.4.x)', () => {
  it('sends a Permissions-Policy that turns unused features off', async () => {
    const policy = (await request(server.app).get('/api/health')).headers['permissions-policy'];
    // W3C Permissions Policy: an empty allowlist "()" disables the feature everywhere
    expect(policy).toContain('camera=()');
    expect(policy).toContain('microphone=()');
    expect(policy).toContain('geolocation=()');
  });
});

describe('request log (ASVS 4.0.3 V7.1.1: no credentials or session tokens in logs)', () => {
  it('writes method, path and status of an API request, nothing of its headers or query', async () => {
    const lines: string[] = [];
    const logger = pino({ level: 'info' }, { write: (line: string) => void lines.push(line) });
    const logged = await startTestServer({}, { logger });
    try {
      await request(logged.app)
        .get('/api/plans?q=lamp-secret')
        .set('Cookie', 'leadbench_session=cookie-secret-value');
      const entry = JSON.parse(lines.find((l) => l.includes('request completed')) ?? '{}') as {
        req?: unknown;
        res?: unknown;
      };
      expect(entry.req).toEqual({ method: 'GET', url: '/api/plans' });
      expect(entry.res).toEqual({ statusCode: 401 }); // the cookie names no session: not signed in
      expect(lines.join('\n')).not.toContain('cookie-secret-value');
      expect(lines.join('\n')).not.toContain('lamp-secret');
    } finally {
      await logged.close();
    }
  });
});
