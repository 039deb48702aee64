import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { SessionInfoSchema } from '../../shared/schemas/auth.schema';
import { createApp } from '../../server/app';
import { loadConfig } from '../../server/config';
import { createMailer } from '../../server/mail/mailer';
import { startTestServer, TEST_PASSWORD, type TestServer } from './server.harness';

let server: TestServer;
let closedPort: number;
beforeAll(async () => {
  server = await startTestServer();
  // A port that just stopped listening: the mail server is down.
  closedPort = server.smtp.port;
  await server.smtp.close();
});
afterAll(async () => {
  await server.close();
});

it('keeps the new account when the welcome mail cannot be sent', async () => {
  const mailer = createMailer({
    host: '127.0.0.1',
    port: closedPort,
    from: 'bench@leadbench.test',
    plain: true,
  });
  const app = createApp({
    db: server.db,
    config: loadConfig({ LOG_LEVEL: 'silent' }),
    mailer,
    logger: pino({ level: 'silent' }),
    clientDir: server.dir,
  });
  const agent = request.agent(app);

  const res = await agent
    .post('/api/auth/sign-up')
    .send({ email: 'offline@bench.test', displayName: 'Off Line', password: TEST_PASSWORD });

  expect(res.status).toBe(201);
  expect(SessionInfoSchema.parse((await agent.get('/api/auth/session')).body).user?.email).toBe(
    'offline@bench.test',
  );
  mailer.close();
});
