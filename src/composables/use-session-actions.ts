/**
 * Signing in, up and out, and the one look-up of the session: the auth API calls, with the session store told
 * what came of them (the store only holds who is signed in; it never fetches).
 */
import type { Pinia } from 'pinia';
import type { SessionInfo, SignIn, SignUp, TotpCode, User } from '@shared/schemas';
import { authApi } from '@/api/auth';
import { useSessionStore } from '@/stores/session.store';

type SessionStore = ReturnType<typeof useSessionStore>;

/** The look-up on its way, per store, so two callers at once share one request. */
const pending = new WeakMap<SessionStore, Promise<User | null>>();

/** Ask the server once; later calls reuse the answer. A failed look-up can be retried. */
export function loadSession(session: SessionStore): Promise<User | null> {
  if (session.loaded) return Promise.resolve(session.user);
  let request = pending.get(session);
  if (!request) {
    request = authApi
      .session()
      .then((found) => {
        session.setUser(found);
        return found;
      })
      .finally(() => pending.delete(session));
    pending.set(session, request);
  }
  return request;
}

export function sessionActions(session: SessionStore) {
  return {
    load: () => loadSession(session),

    /** The answer as sent: no user yet while `secondFactorRequired` (finish with `secondFactor`). */
    async signIn(input: SignIn): Promise<SessionInfo> {
      const info = await authApi.signIn(input);
      session.setUser(info.user);
      return info;
    },

    async secondFactor(input: TotpCode): Promise<User | null> {
      const info = await authApi.secondFactor(input);
      session.setUser(info.user);
      return info.user;
    },

    /** The new user, or null when a verification mail went out instead (no session yet). */
    async signUp(input: SignUp): Promise<User | null> {
      const info = await authApi.signUp(input);
      session.setUser(info.user);
      return info.user;
    },

    /** Forgets the user here even when the server cannot be reached (the error is still passed on). */
    async signOut(): Promise<void> {
      try {
        await authApi.signOut();
      } finally {
        session.setUser(null);
      }
    },
  };
}

export function useSessionActions(pinia?: Pinia) {
  return sessionActions(useSessionStore(pinia));
}
