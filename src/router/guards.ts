/**
 * Route guards that mirror the server's roles. The server still checks every request;
 * these only keep people from landing on pages that would refuse them.
 */
import type { Pinia } from 'pinia';
import type { RouteLocationNormalized, RouteLocationRaw, Router } from 'vue-router';
import { useRecentStore } from '@/stores/recent.store';
import { ROLE_HOME } from './role-home';

export async function decideAccess(
  to: RouteLocationNormalized,
  pinia: Pinia,
): Promise<true | RouteLocationRaw> {
  if (to.meta.light) return true;
  // Loaded on demand: the session brings the API client and its schemas, which a light page does not need.
  const { useSessionStore, loadSession } = await import('@/plugins/app-kit');
  const session = useSessionStore(pinia);
  if (!session.loaded) {
    try {
      await loadSession(session);
    } catch {
      // Server unreachable: treat as signed out; public pages still open, the sign-in form reports the outage.
    }
  }
  const user = session.user;

  if (to.meta.guestOnly && user) return ROLE_HOME[user.role];
  if (to.meta.public) return true;
  if (!user) return { name: 'sign-in', query: { next: to.fullPath } };
  if (to.meta.roles && !to.meta.roles.includes(user.role)) {
    return { name: 'forbidden', query: { from: to.fullPath } };
  }
  return true;
}

export function installGuards(router: Router, pinia: Pinia): void {
  router.beforeEach((to) => decideAccess(to, pinia));
  router.afterEach((to, _from, failure) => {
    if (failure) return;
    if (typeof document !== 'undefined') {
      document.title = to.meta.title ? `${to.meta.title} · Leadbench` : 'Leadbench';
    }
    if (to.name === 'bench' && typeof to.params.id === 'string') {
      useRecentStore(pinia).rememberPlan(to.params.id);
    }
  });
}
