import type { Component } from 'vue';
import type { RouteRecordRaw } from 'vue-router';
import type { Role } from '@shared/schemas';
// The landing comes with the entry: it is the first page of a first visit, and it is small.
import LandingPage from '@/pages/landing/index.vue';
import type { PageName } from './pages';

declare module 'vue-router' {
  interface RouteMeta {
    /** Shown in the tab title. */
    title?: string;
    /** Open to anyone; every other route needs a signed-in user. */
    public?: boolean;
    /** Sign-in and sign-up: a signed-in user is sent to their home instead. */
    guestOnly?: boolean;
    /** Roles allowed in; absent means every signed-in role. */
    roles?: readonly Role[];
    /** The page fills the window below the top bar (the canvas). */
    fullBleed?: boolean;
    /** Drawn in the light shell, without the component kit or a session look-up, so a first visit loads little. */
    light?: boolean;
  }
}

export const DRILL_ROLES: readonly Role[] = ['trainee', 'instructor', 'admin'];
export const PEOPLE_ROLES: readonly Role[] = ['admin'];
export const TEACHING_ROLES: readonly Role[] = ['instructor', 'admin'];

/** A page's component, loaded with the module of page imports (`./pages`) on the first visit to one. */
function page(name: PageName): () => Promise<{ default: Component }> {
  return () =>
    import('./pages').then((m) => {
      const load: () => Promise<{ default: Component }> = m.pages[name];
      return load();
    });
}

/** A revision number from the address, or undefined for anything else (the current copy then opens). */
function revisionOf(value: unknown): number | undefined {
  const n = typeof value === 'string' ? Number(value) : NaN;
  return Number.isInteger(n) && n >= 1 ? n : undefined;
}

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    name: 'landing',
    component: LandingPage,
    meta: { public: true, light: true, title: 'Key systems, wired right' },
  },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: page('signIn'),
    meta: { public: true, guestOnly: true, title: 'Sign in' },
  },
  {
    path: '/sign-up',
    name: 'sign-up',
    component: page('signUp'),
    meta: { public: true, guestOnly: true, title: 'Create an account' },
  },
  {
    path: '/forgot-password',
    name: 'forgot-password',
    component: page('forgotPassword'),
    meta: { public: true, title: 'Forgot password' },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: page('resetPassword'),
    meta: { public: true, title: 'Choose a new password' },
  },
  {
    path: '/verify-email',
    name: 'verify-email',
    component: page('verifyEmail'),
    meta: { public: true, title: 'Confirm e-mail address' },
  },
  {
    path: '/plans',
    name: 'plans',
    component: page('plans'),
    meta: { title: 'Plans' },
  },
  {
    path: '/plans/:id',
    name: 'bench',
    component: page('bench'),
    // `?revision=3` opens that saved revision to look at.
    props: (r) => ({ id: r.params.id, revision: revisionOf(r.query.revision) }),
    meta: { title: 'Bench', fullBleed: true },
  },
  {
    path: '/try',
    name: 'try',
    component: page('bench'),
    props: { guest: true },
    meta: { public: true, title: 'Try the Bench', fullBleed: true },
  },
  {
    path: '/plans/:id/sheet',
    name: 'work-sheet',
    component: page('workSheet'),
    props: true,
    meta: { title: 'Work sheet' },
  },
  {
    path: '/shared/:token',
    name: 'shared-link',
    component: page('sharedLink'),
    props: true,
    meta: { title: 'Shared plan' },
  },
  {
    path: '/drills',
    children: [
      { path: '', name: 'drills', component: page('drills'), meta: { title: 'Drills', roles: DRILL_ROLES } },
      { path: 'join/:token', name: 'drills-join', component: page('drillsJoin'), props: true, meta: { public: true, title: 'Join a class' } },
      { path: 'progress', name: 'drills-progress', component: page('drillsProgress'), meta: { title: 'My progress' } },
      { path: 'classes/:id', name: 'drills-class', component: page('classDesk'), props: true, meta: { title: 'Class desk', roles: TEACHING_ROLES } },
      { path: 'puzzles/new', name: 'drills-puzzle-maker', component: page('puzzleMaker'), meta: { title: 'Puzzle maker', roles: TEACHING_ROLES } },
      { path: 'hunt/:assignmentId', name: 'drills-hunt', component: page('faultHunt'), props: true, meta: { title: 'Fault hunt' } },
      { path: 'demonstrations/new', name: 'drills-demo-builder', component: page('demonstrationBuilder'), meta: { title: 'Demonstration builder', roles: TEACHING_ROLES, fullBleed: true } },
      { path: 'demonstrations/:id/present', name: 'drills-projector', component: page('projector'), props: (r) => ({ id: r.params.id, source: 'own' }), meta: { title: 'Projector view', roles: TEACHING_ROLES, fullBleed: true } },
      { path: 'step-through/:id', name: 'drills-step-through', component: page('projector'), props: (r) => ({ id: r.params.id, source: 'assigned' }), meta: { title: 'Step-through', fullBleed: true } },
    ],
  },
  {
    path: '/account',
    name: 'account',
    component: page('account'),
    meta: { title: 'Account' },
  },
  {
    path: '/people',
    name: 'people',
    component: page('people'),
    meta: { title: 'People', roles: PEOPLE_ROLES },
  },
  {
    path: '/forbidden',
    name: 'forbidden',
    component: page('forbidden'),
    meta: { public: true, title: 'Not for this account' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: page('notFound'),
    meta: { public: true, title: 'Page not found' },
  },
];
