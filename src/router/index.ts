import type { Pinia } from 'pinia';
import { createRouter, type RouterHistory } from 'vue-router';
import { installGuards } from './guards';
import { routes } from './routes';

/** Optional progress display around each navigation (the loading bar in the browser). */
export interface NavigationProgress {
  start(): void;
  finish(): void;
  error(): void;
}

export function createAppRouter(history: RouterHistory, pinia: Pinia, progress?: NavigationProgress) {
  const router = createRouter({
    history,
    routes,
    scrollBehavior: (_to, _from, saved) => saved ?? { top: 0 },
  });
  // Registered before the guards so the bar also covers the first session look-up.
  if (progress) router.beforeEach(() => progress.start());
  installGuards(router, pinia);
  if (progress) {
    router.afterEach((_to, _from, failure) => (failure ? progress.error() : progress.finish()));
    router.onError(() => progress.error());
  }
  return router;
}
