/**
 * What every page but the landing needs before it opens, in one module fetched on the first navigation to such a
 * page: the session and its look-up, the API client's session hook and the data-loading kit. The landing (a light
 * page) loads none of it, nor the lists of files these modules need.
 */
export { useSessionStore } from '@/stores/session.store';
export { loadSession } from '@/composables/use-session-actions';
export { retryUnlessRefused, setUnauthenticatedHandler } from '@/api/client';
export { VueQueryPlugin } from '@tanstack/vue-query';

/** The route loading bar (naive-ui), fetched from the second navigation on (see naive-ui.ts). */
export const loadLoadingBar = () => import('./naive-discrete');
