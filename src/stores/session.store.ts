/**
 * Who is signed in. The store only holds the answer; `src/composables/use-session-actions.ts` asks the server
 * (look-up, sign-in, sign-up, sign-out) and tells the store what came of it.
 */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { Role, User } from '@shared/schemas';

export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null);
  /** The server has been asked at least once (a signed-out answer counts). */
  const loaded = ref(false);

  const signedIn = computed(() => user.value !== null);
  const role = computed<Role | null>(() => user.value?.role ?? null);

  function hasRole(...roles: Role[]): boolean {
    return user.value !== null && roles.includes(user.value.role);
  }

  /** What the server said about the session (also for role changes made elsewhere). */
  function setUser(next: User | null): void {
    user.value = next;
    loaded.value = true;
  }

  return { user, loaded, signedIn, role, hasRole, setUser };
});
