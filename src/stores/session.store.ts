/** Who is signed in. Loads the session once; components decide how errors look. */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { Role, SessionInfo, SignIn, SignUp, TotpCode, User } from '@shared/schemas';
import { authApi } from '@/api/auth';

export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null);
  const loaded = ref(false);
  let pending: Promise<User | null> | null = null;

  const signedIn = computed(() => user.value !== null);
  const role = computed<Role | null>(() => user.value?.role ?? null);

  /** Ask the server once; later calls reuse the answer. A failed load can be retried. */
  function load(): Promise<User | null> {
    if (loaded.value) return Promise.resolve(user.value);
    pending ??= authApi
      .session()
      .then((found) => {
        user.value = found;
        loaded.value = true;
        return found;
      })
      .finally(() => {
        pending = null;
      });
    return pending;
  }

  /** The answer as sent: no user yet while `secondFactorRequired` (finish with `secondFactor`). */
  async function signIn(input: SignIn): Promise<SessionInfo> {
    const info = await authApi.signIn(input);
    user.value = info.user;
    loaded.value = true;
    return info;
  }

  async function secondFactor(input: TotpCode): Promise<User | null> {
    const info = await authApi.secondFactor(input);
    user.value = info.user;
    loaded.value = true;
    return info.user;
  }

  /** The new user, or null when a verification mail went out instead (no session yet). */
  async function signUp(input: SignUp): Promise<User | null> {
    const info = await authApi.signUp(input);
    user.value = info.user;
    loaded.value = true;
    return info.user;
  }

  async function signOut(): Promise<void> {
    try {
      await authApi.signOut();
    } finally {
      user.value = null;
      loaded.value = true;
    }
  }

  function hasRole(...roles: Role[]): boolean {
    return user.value !== null && roles.includes(user.value.role);
  }

  /** For role changes made elsewhere (an admin editing their own row is refused by the server). */
  function setUser(next: User | null): void {
    user.value = next;
    loaded.value = true;
  }

  return { user, loaded, signedIn, role, load, signIn, secondFactor, signUp, signOut, hasRole, setUser };
});
