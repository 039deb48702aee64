/**
 * The signed-in user as far as this tab already knows, without looking the session up: the landing page stays
 * free of the API client. On a first visit nothing is known yet and the page speaks to a visitor; coming back
 * from inside the app, the session store's state is there and the page greets its user.
 */
import { computed, type ComputedRef } from 'vue';
import { getActivePinia } from 'pinia';
import type { User } from '@shared/schemas';

export function useKnownUser(): ComputedRef<User | null> {
  const pinia = getActivePinia();
  return computed(() => (pinia?.state.value.session as { user?: User | null } | undefined)?.user ?? null);
}
