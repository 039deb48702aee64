import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { KnexAdapter } from '../../server/auth/knex-adapter';
import { signedInAgent, startTestServer, type TestServer } from './server.harness';

let server: TestServer;
let adapter: KnexAdapter;
let userId: string;

beforeAll(async () => {
  server = await startTestServer();
  adapter = new KnexAdapter(server.db);
  userId = (await signedInAgent(server)).user.id;
  await adapter.deleteUserSessions(userId);
});
afterAll(async () => {
  await server.close();
});

describe('KnexAdapter (lucia Adapter over Knex)', () => {
  it('stores a session and returns it with its user', async () => {
    const expiresAt = new Date(Date.UTC(2030, 0, 1)); // any future instant
    await adapter.setSession({ id: 'sess-a', userId, expiresAt, attributes: {} });
    const [session, user] = await adapter.getSessionAndUser('sess-a');
    expect(session).toEqual({ id: 'sess-a', userId, expiresAt, attributes: {} });
    expect(user?.id).toBe(userId);
    expect(user?.attributes.role).toBe('restorer'); // accounts made by sign-up are restorers (product rule)
  });

  it('answers [null, null] for an unknown session', async () => {
    expect(await adapter.getSessionAndUser('no-such-session')).toEqual([null, null]);
  });

  it('lists, extends and deletes a user’s sessions', async () => {
    await adapter.setSession({
      id: 'sess-b',
      userId,
      expiresAt: new Date(Date.UTC(2030, 0, 2)),
      attributes: {},
    });
    expect((await adapter.getUserSessions(userId)).map((s) => s.id).sort()).toEqual(['sess-a', 'sess-b']);

    const later = new Date(Date.UTC(2031, 5, 1));
    await adapter.updateSessionExpiration('sess-b', later);
    expect((await adapter.getSessionAndUser('sess-b'))[0]?.expiresAt).toEqual(later);

    await adapter.deleteSession('sess-a');
    expect((await adapter.getUserSessions(userId)).map((s) => s.id)).toEqual(['sess-b']);
    await adapter.deleteUserSessions(userId);
    expect(await adapter.getUserSessions(userId)).toEqual([]);
  });

  it('deletes only expired sessions', async () => {
    await adapter.setSession({ id: 'old', userId, expiresAt: new Date(Date.now() - 60_000), attributes: {} });
    await adapter.setSession({ id: 'new', userId, expiresAt: new Date(Date.now() + 60_000), attributes: {} });
    await adapter.deleteExpiredSessions();
    expect((await adapter.getUserSessions(userId)).map((s) => s.id)).toEqual(['new']);
  });
});
