import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import type { User } from '@shared/schemas';
import { useSessionStore } from '@/stores/session.store';
import { useSessionActions } from '@/composables/use-session-actions';
import { ApiError } from '@/api/client';

const wren: User = {
  id: 'u-1',
  email: 'wren@example.org',
  displayName: 'Wren',
  role: 'instructor',
  createdAt: '2026-01-05T10:00:00.000Z',
};

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('the session store and the actions that fill it', () => {
  it('loads the session once even when asked twice at the same time', async () => {
    const fetchMock = vi.fn(async () => Response.json({ user: wren }));
    vi.stubGlobal('fetch', fetchMock);
    const session = useSessionStore();
    const actions = useSessionActions();

    const [a, b] = await Promise.all([actions.load(), actions.load()]);
    await actions.load();

    expect(a).toEqual(wren);
    expect(b).toEqual(wren);
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(session.hasRole('instructor', 'admin')).toBe(true);
    expect(session.hasRole('admin')).toBe(false);
  });

  it('keeps the user out after a refused sign-in', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        Response.json({ error: { code: 'BAD_CREDENTIALS', message: 'Wrong' } }, { status: 401 }),
      ),
    );
    const session = useSessionStore();

    await expect(
      useSessionActions().signIn({ email: 'wren@example.org', password: 'nope' }),
    ).rejects.toBeInstanceOf(ApiError);
    expect(session.user).toBeNull();
  });

  it('forgets the user on sign-out even when the server cannot be reached', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ user: wren })),
    );
    const session = useSessionStore();
    const actions = useSessionActions();
    await actions.signIn({ email: 'wren@example.org', password: 'right password' });
    expect(session.signedIn).toBe(true);

    vi.stubGlobal('fetch', vi.fn().mockRejectedValue(new TypeError('Failed to fetch')));
    await expect(actions.signOut()).rejects.toMatchObject({ code: 'NETWORK' });
    expect(session.user).toBeNull();
  });

  it('starts no session when sign-up answers 202 with a verification mail sent', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Response.json({ user: null, verificationSent: true }, { status: 202 })),
    );
    const session = useSessionStore();

    await expect(
      useSessionActions().signUp({
        email: 'wren@example.org',
        displayName: 'Wren',
        password: 'copper-pair-lamp-relay',
      }),
    ).resolves.toBeNull();
    expect(session.signedIn).toBe(false);
  });

  it('stays signed out after the password until the second-factor code is accepted', async () => {
    const fetchMock = vi.fn(async () => Response.json({ user: null, secondFactorRequired: true }));
    vi.stubGlobal('fetch', fetchMock);
    const session = useSessionStore();
    const actions = useSessionActions();

    const info = await actions.signIn({ email: 'wren@example.org', password: 'right password' });
    expect(info.secondFactorRequired).toBe(true);
    expect(session.signedIn).toBe(false);

    fetchMock.mockImplementation(async () => Response.json({ user: wren }));
    await expect(actions.secondFactor({ code: '123456' })).resolves.toEqual(wren);
    expect(fetchMock).toHaveBeenLastCalledWith(
      '/api/auth/second-factor',
      expect.objectContaining({ method: 'POST' }),
    );
    expect(session.signedIn).toBe(true);
  });
});
