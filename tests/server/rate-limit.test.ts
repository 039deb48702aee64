import request from 'supertest';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { startTestServer, type TestServer } from './server.harness';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ RATE_LIMIT_MAX: '3' });
});
afterAll(async () => {
  await server.close();
});

it('answers 429 RATE_LIMITED once the sign-in budget is spent', async () => {
  const attempt = () =>
    request(server.app).post('/api/auth/sign-in').send({ email: 'x@bench.test', password: 'wrong one' });
  // Arrange: spend the budget of 3 set in this file
  for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
  // Act
  const res = await attempt();
  // Assert
  expect(res.status).toBe(429); // RFC 6585 §4: 429 Too Many Requests
  expect(ErrorBodySchema.parse(res.body).error).toEqual({
    code: 'RATE_LIMITED',
    message: 'Too many attempts. Wait a few minutes and try again.', // our own wording
  });
  // Sign-up shares the budget
  const signUp = await request(server.app).post('/api/auth/sign-up').send({});
  expect(signUp.status).toBe(429);
  // Other routes are not limited
  expect((await request(server.app).get('/api/auth/session')).status).toBe(200);
});
