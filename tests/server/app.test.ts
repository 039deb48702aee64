import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema, HealthSchema } from '../../shared/schemas/error.schema';
import { SessionInfoSchema } from '../../shared/schemas/auth.schema';
import { ConfigError, loadConfig } from '../../server/config';
import { signedInAgent, startTestServer, type TestServer } from './server.harness';
import packageJson from '../../package.json' with { type: 'json' };

let server: TestServer;
let clientDir: string;

beforeAll(async () => {
  server = await startTestServer();
  // A stand-in client build in this file's temp folder, so the fallback is tested with or without dist/.
  clientDir = join(server.dir, 'client');
  mkdirSync(join(clientDir, 'assets'), { recursive: true });
  writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>bench shell</title>');
  writeFileSync(join(clientDir, 'assets', 'app.js'), 'console.log("bench");');
});
afterAll(async () => {
  await server.close();
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;

describe('GET /api/health', () => {
  it('reports the package version and a working database', async () => {
    const res = await request(server.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(HealthSchema.parse(res.body)).toEqual({
      status: 'ok',
      version: packageJson.version,
      database: 'ok',
    });
  });
});

describe('API edges', () => {
  it('answers an unknown API route with 404 NOT_FOUND in the error shape', async () => {
    const res = await request(server.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(errorOf(res.body)).toEqual({
      code: 'NOT_FOUND',
      message: 'There is no API route GET /no-such-thing.',
    });
  });

  it('answers a malformed path escape with 400, not a server error', async () => {
    const { agent } = await signedInAgent(server);
    const res = await agent.get('/api/plans/%E0%A4%A');
    expect(res.status).toBe(400); // RFC 3986 §2.1: "%A" is not a valid percent-encoding
    expect(errorOf(res.body)).toEqual({
      code: 'VALIDATION_FAILED',
      message: 'The request could not be understood.', // our own wording
    });
  });

  it('answers a body in another character set with 400 BAD_JSON', async () => {
    const res = await request(server.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json; charset=latin-9')
      .send('{}');
    expect(res.status).toBe(400);
    expect(errorOf(res.body)).toEqual({ code: 'BAD_JSON', message: 'Send the body as UTF-8 JSON.' }); // our own wording
  });

  it('sends a same-origin-only Content-Security-Policy', async () => {
    const csp = (await request(server.app).get('/api/health')).headers['content-security-policy'];
    // OWASP Content Security Policy Cheat Sheet: default-src 'self', no inline scripts, no framing
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self' 'wasm-unsafe-eval';");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
  });

  it('marks the session cookie Secure when SESSION_SECURE is set', async () => {
    const secure = await startTestServer({ SESSION_SECURE: 'true' });
    try {
      const res = await request(secure.app)
        .post('/api/auth/sign-up')
        .send({ email: 'secure@bench.test', displayName: 'Sec Ure', password: 'correct horse battery' });
      const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).join('\n');
      expect(cookie).toMatch(/; Secure/); // RFC 6265 §4.1.2.5
    } finally {
      await secure.close();
    }
  });

  it('answers an unexpected failure with a generic 500 INTERNAL and a degraded health', async () => {
    const broken = await startTestServer();
    const { agent } = await signedInAgent(broken);
    await broken.db.schema.dropTable('plans');
    try {
      const res = await agent.get('/api/plans');
      expect(res.status).toBe(500); // RFC 9110 §15.6.1
      expect(errorOf(res.body)).toEqual({
        code: 'INTERNAL',
        message: 'Something went wrong on the server. Please try again.', // our own wording
      });
      expect(JSON.stringify(res.body)).not.toMatch(/plans|sqlite/i);
    } finally {
      await broken.close();
    }
  });

  it('reports the database as unavailable when it is closed', async () => {
    const closed = await startTestServer();
    await closed.db.destroy();
    const res = await request(closed.app).get('/api/health');
    expect(res.status).toBe(503); // RFC 9110 §15.6.4: 503 Service Unavailable
    expect(HealthSchema.parse(res.body)).toMatchObject({ status: 'degraded', database: 'unavailable' });
  });
});

describe('built client', () => {
  let withClient: TestServer;
  beforeAll(async () => {
    withClient = await startTestServer({}, { clientDir });
  });
  afterAll(async () => {
    await withClient.close();
  });

  it('serves index.html for client routes (history fallback)', async () => {
    const res = await request(withClient.app).get('/plans/abc/bench');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('bench shell');
  });

  it('serves static files as they are', async () => {
    const res = await request(withClient.app).get('/assets/app.js');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable'); // RFC 8246 immutable; 1 year
    expect(res.text).toBe('console.log("bench");');
  });

  it('answers a missing asset with 404, not the page', async () => {
    const res = await request(withClient.app).get('/assets/old-chunk.js');
    expect(res.status).toBe(404);
    expect(res.text).not.toContain('bench shell');
  });

  it('keeps unknown API routes as JSON 404, not the page', async () => {
    const res = await request(withClient.app).get('/api/plans-typo');
    expect(res.status).toBe(404);
    expect(errorOf(res.body).code).toBe('NOT_FOUND');
  });

  it('has no fallback when there is no build', async () => {
    const res = await request(server.app).get('/plans/abc/bench');
    expect(res.status).toBe(404);
  });
});

describe('configuration', () => {
  it('applies the documented defaults', () => {
    const config = loadConfig({});
    expect(config).toMatchObject({
      port: 3000,
      host: '127.0.0.1',
      databaseFile: 'data/leadbench.sqlite',
      sessionSecure: false,
      sessionAbsoluteHours: 720,
      sessionIdleHours: 168,
      emailVerification: false,
      publicOrigin: 'http://localhost:3000',
      mail: null,
      seedDemo: true,
      trustProxy: 0,
    });
  });

  it('seeds nothing and verifies e-mail by default in production (ASVS 4.0.3 V2.5.4, V14.1.1)', () => {
    expect(loadConfig({ NODE_ENV: 'production' })).toMatchObject({
      seedDemo: false,
      emailVerification: true,
    });
    expect(loadConfig({ NODE_ENV: 'production', SEED_DEMO: 'true' }).seedDemo).toBe(true);
  });

  it('derives the public origin from PORT and trims a given one to its origin', () => {
    expect(loadConfig({ PORT: '8080' }).publicOrigin).toBe('http://localhost:8080');
    expect(loadConfig({ PUBLIC_ORIGIN: 'https://bench.example.org/app/' }).publicOrigin).toBe(
      'https://bench.example.org',
    );
  });

  it('names every bad variable', () => {
    const attempt = () => loadConfig({ PORT: 'eighty', SESSION_SECURE: 'maybe', PUBLIC_ORIGIN: 'ftp://x' });
    expect(attempt).toThrow(ConfigError);
    // messages from server/config.ts
    expect(attempt).toThrow(/PORT: Use a port number/);
    expect(attempt).toThrow(/SESSION_SECURE: Use true or false/);
    // ASVS 4.0.3 V2.2.1: "true" would believe any X-Forwarded-For a client makes up
    expect(() => loadConfig({ TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY: Use a number of proxy hops/);
    expect(() => loadConfig({ SESSION_DAYS: '30' })).toThrow(/SESSION_DAYS was replaced/);
    expect(loadConfig({ TRUST_PROXY: '2' }).trustProxy).toBe(2);
    expect(attempt).toThrow(/PUBLIC_ORIGIN: Use an origin like https:\/\/bench\.example\.org/);
  });
});

describe('database', () => {
  it('removes a deleted user’s sessions and plans (foreign keys on, cascade)', async () => {
    const { agent, user } = await signedInAgent(server);
    await agent.post('/api/plans').send({
      document: {
        version: 1,
        name: 'Cascade',
        ksu: { id: 'ksu', name: 'KSU', lines: [{ number: 1, directoryNumber: '5550199' }] },
      },
    });
    await server.db('users').where({ id: user.id }).delete();
    expect(await server.db('sessions').where({ user_id: user.id })).toHaveLength(0);
    expect(await server.db('plans').where({ owner_id: user.id })).toHaveLength(0);
    expect(SessionInfoSchema.parse((await agent.get('/api/auth/session')).body).user).toBeNull();
  });

  it('runs in WAL mode', async () => {
    const rows = (await server.db.raw('pragma journal_mode')) as { journal_mode: string }[];
    expect(rows[0].journal_mode).toBe('wal'); // SQLite docs: pragma journal_mode reports "wal"
  });
});
