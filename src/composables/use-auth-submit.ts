import { computed, ref } from 'vue';
import { useRoute } from 'vue-router';
import type { User } from '@shared/schemas';
import { useAfterSignIn } from './use-after-sign-in';

/**
 * The sign-in and sign-up pages: run the session call, keep its pending state and failure for the
 * form, go on to the right page once signed in, and carry `?next=` over to the other page's link.
 * An act that answers null (a second step is owed) stays on the page.
 */
export function useAuthSubmit<V>(act: (values: V) => Promise<User | null>, otherPath: string) {
  const route = useRoute();
  const goOn = useAfterSignIn();

  const pending = ref(false);
  const error = ref<unknown>(null);
  const otherLink = computed(() => ({
    path: otherPath,
    query: route.query.next ? { next: route.query.next } : {},
  }));

  async function submit(values: V) {
    pending.value = true;
    error.value = null;
    try {
      const user = await act(values);
      if (user) await goOn(user);
    } catch (caught) {
      error.value = caught;
    } finally {
      pending.value = false;
    }
  }

  return { pending, error, otherLink, submit };
}
