import { useRoute, useRouter } from 'vue-router';
import type { User } from '@shared/schemas';
import { ROLE_HOME, safeNext } from '@/router/role-home';
import { GUEST_KEEP_NEXT, useKeepGuestPlan } from './bench/use-guest-plan';

/**
 * Where to go once signed in: the `?next=` page when it is ours and open to the user's role,
 * else the role's home (a new restorer sent from Drills should not land on a refusal). Coming from the
 * guest bench's offer, the drawing kept there is saved as the user's plan first and opened on the Bench.
 */
export function useAfterSignIn() {
  const route = useRoute();
  const router = useRouter();
  const keepGuestPlan = useKeepGuestPlan();
  return async (user: User) => {
    const next = safeNext(route.query.next);
    if (next === GUEST_KEEP_NEXT) {
      const id = await keepGuestPlan();
      if (id) return router.replace({ name: 'bench', params: { id } });
    }
    const target = next ? router.resolve(next) : null;
    const allowed = target && (!target.meta.roles || target.meta.roles.includes(user.role));
    return router.replace(allowed && next ? next : ROLE_HOME[user.role]);
  };
}
