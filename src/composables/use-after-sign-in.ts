import { useRoute, useRouter } from 'vue-router';
import type { User } from '@shared/schemas';
import { ROLE_HOME, safeNext } from '@/router/role-home';

/**
 * Where to go once signed in: the `?next=` page when it is ours and open to the user's role,
 * else the role's home (a new restorer sent from Drills should not land on a refusal).
 */
export function useAfterSignIn() {
  const route = useRoute();
  const router = useRouter();
  return (user: User) => {
    const next = safeNext(route.query.next);
    const target = next ? router.resolve(next) : null;
    const allowed = target && (!target.meta.roles || target.meta.roles.includes(user.role));
    return router.replace(allowed && next ? next : ROLE_HOME[user.role]);
  };
}
