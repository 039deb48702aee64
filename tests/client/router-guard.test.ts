import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, type Pinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import type { Role, User } from '@shared/schemas';
import { createAppRouter } from '@/router';
import { safeNext } from '@/router/role-home';

function userWith(role: Role): User {
  return {
    id: `u-${role}`,
    email: `${role}@example.org`,
    displayName: `A ${role}`,
    role,
    createdAt: '2026-01-05T10:00:00.000Z',
  };
}

/** The server's session answer, as in shared/schemas/auth.schema.ts (SessionInfoSchema). */
function serveSession(user: User | null) {
  const fetchMock = vi.fn(async (url: string) => {
    if (url === '/api/auth/session') return Response.json({ user });
    return Response.json({ error: { code: 'NOT_FOUND', message: 'No such route' } }, { status: 404 });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

let pinia: Pinia;

beforeEach(() => {
  pinia = createPinia();
});

afterEach(() => {
  vi.unstubAllGlobals();
});

async function visit(path: string) {
  const router = createAppRouter(createMemoryHistory(), pinia);
  await router.push(path);
  return router.currentRoute.value;
}

describe('route guards', () => {
  it('sends an anonymous visitor to sign-in and remembers where they were going', async () => {
    serveSession(null);
    const route = await visit('/plans/p-42?view=leads');
    expect(route.name).toBe('sign-in');
    expect(route.query.next).toBe('/plans/p-42?view=leads');
  });

  it('lets an anonymous visitor see the landing page', async () => {
    serveSession(null);
    expect((await visit('/')).name).toBe('landing');
  });

  it('shows the forbidden page when a trainee opens People', async () => {
    serveSession(userWith('trainee'));
    const route = await visit('/people');
    expect(route.name).toBe('forbidden');
    expect(route.query.from).toBe('/people');
  });

  it('keeps restorers out of Drills', async () => {
    serveSession(userWith('restorer'));
    expect((await visit('/drills')).name).toBe('forbidden');
  });

  it('lets an administrator into People and a trainee into Drills', async () => {
    serveSession(userWith('admin'));
    expect((await visit('/people')).name).toBe('people');
    pinia = createPinia();
    serveSession(userWith('trainee'));
    expect((await visit('/drills')).name).toBe('drills');
  });

  it("sends a signed-in user away from sign-in to their role's home", async () => {
    serveSession(userWith('trainee'));
    // Role homes are our own product decision (common practice, no published source).
    expect((await visit('/sign-in')).path).toBe('/drills');
  });

  it('asks the server about the session only once', async () => {
    const fetchMock = serveSession(userWith('restorer'));
    const router = createAppRouter(createMemoryHistory(), pinia);
    await router.push('/plans');
    await router.push('/account');
    expect(router.currentRoute.value.name).toBe('account');
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  it('treats an unreachable server as signed out', async () => {
    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));
    expect((await visit('/account')).name).toBe('sign-in');
  });
});

describe('safeNext', () => {
  it('accepts only paths on this site', () => {
    expect(safeNext('/plans/p-1')).toBe('/plans/p-1');
    // Protocol-relative and backslash forms leave the site in browsers (OWASP Unvalidated Redirects cheat sheet).
    expect(safeNext('//evil.example/x')).toBeNull();
    expect(safeNext('/\\evil.example')).toBeNull();
    expect(safeNext('https://evil.example/')).toBeNull();
    expect(safeNext(['/plans'])).toBeNull();
  });
});
