import type { App } from 'vue';
import type { Pinia } from 'pinia';
import { createWebHistory } from 'vue-router';
import { createAppRouter } from '@/router';
import { lazyLoadingBar } from './naive-ui';

export function createBrowserRouter(app: App, pinia: Pinia) {
  const loadingBar = lazyLoadingBar(pinia);
  const router = createAppRouter(createWebHistory(import.meta.env.BASE_URL), pinia, loadingBar);

  // A session that ends while a page is open (expiry, password changed elsewhere): back to sign-in,
  // then return to the same page. The Bench is left alone: it holds unsaved edits and reports the
  // failed save itself, so leaving it here could lose work. Registered on the first page that is not light
  // (the landing does without the API client), before any of its requests. The data-loading kit is installed
  // there too: only those pages load data, and the landing need not fetch it.
  let watching = false;
  router.beforeEach(async (to) => {
    if (watching || to.meta.light) return;
    watching = true;
    // The page imports are needed once the guards pass; fetch them alongside the session look-up.
    void import('@/router/pages').catch(() => undefined);
    const { setUnauthenticatedHandler, retryUnlessRefused, useSessionStore, VueQueryPlugin } = await import('./app-kit');
    app.use(VueQueryPlugin, { queryClientConfig: { defaultOptions: { queries: { retry: retryUnlessRefused } } } });
    setUnauthenticatedHandler(() => {
      const session = useSessionStore(pinia);
      const current = router.currentRoute.value;
      if (!session.user || current.name === 'bench') return;
      session.setUser(null);
      if (!current.meta.public) void router.replace({ name: 'sign-in', query: { next: current.fullPath } });
    });
  });
  // A new build replaces the lazily loaded page chunks; a tab opened before it fails to fetch them. Load the
  // target page afresh once instead of leaving the user on a broken screen.
  router.onError((error, to) => {
    const stale = /dynamically imported module|Importing a module script failed/i.test(
      String(error?.message),
    );
    const key = `leadbench:reloaded:${to.fullPath}`;
    if (stale && !sessionStorage.getItem(key)) {
      sessionStorage.setItem(key, '1');
      window.location.assign(to.fullPath);
    }
  });
  return router;
}
