import type { RouteRecordRaw } from 'vue-router';
import type { Role } from '@shared/schemas';

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

/** A revision number from the address, or undefined for anything else (the current copy then opens). */
function revisionOf(value: unknown): number | undefined {
  const n = typeof value === 'string' ? Number(value) : NaN;
  return Number.isInteger(n) && n >= 1 ? n : undefined;
}

export const routes: RouteRecordRaw[] = [
  {
    path: '/',
    name: 'landing',
    component: () => import('@/pages/landing/index.vue'),
    meta: { public: true, light: true, title: 'Key systems, wired right' },
  },
  {
    path: '/sign-in',
    name: 'sign-in',
    component: () => import('@/pages/sign-in/index.vue'),
    meta: { public: true, guestOnly: true, title: 'Sign in' },
  },
  {
    path: '/sign-up',
    name: 'sign-up',
    component: () => import('@/pages/sign-up/index.vue'),
    meta: { public: true, guestOnly: true, title: 'Create an account' },
  },
  {
    path: '/forgot-password',
    name: 'forgot-password',
    component: () => import('@/pages/password/ForgotPasswordPage.vue'),
    meta: { public: true, title: 'Forgot password' },
  },
  {
    path: '/reset-password',
    name: 'reset-password',
    component: () => import('@/pages/password/ResetPasswordPage.vue'),
    meta: { public: true, title: 'Choose a new password' },
  },
  {
    path: '/verify-email',
    name: 'verify-email',
    component: () => import('@/pages/verify-email/index.vue'),
    meta: { public: true, title: 'Confirm e-mail address' },
  },
  {
    path: '/plans',
    name: 'plans',
    component: () => import('@/pages/plans/index.vue'),
    meta: { title: 'Plans' },
  },
  {
    path: '/plans/:id',
    name: 'bench',
    component: () => import('@/pages/bench/index.vue'),
    // `?revision=3` opens that saved revision to look at.
    props: (r) => ({ id: r.params.id, revision: revisionOf(r.query.revision) }),
    meta: { title: 'Bench', fullBleed: true },
  },
  {
    path: '/try',
    name: 'try',
    component: () => import('@/pages/bench/index.vue'),
    props: { guest: true },
    meta: { public: true, title: 'Try the Bench', fullBleed: true },
  },
  {
    path: '/plans/:id/sheet',
    name: 'work-sheet',
    component: () => import('@/pages/work-sheet/index.vue'),
    props: true,
    meta: { title: 'Work sheet' },
  },
  {
    path: '/shared/:token',
    name: 'shared-link',
    component: () => import('@/pages/plans/SharedLinkPage.vue'),
    props: true,
    meta: { title: 'Shared plan' },
  },
  {
    path: '/drills',
    children: [
      { path: '', name: 'drills', component: () => import('@/pages/drills/index.vue'), meta: { title: 'Drills', roles: DRILL_ROLES } },
      { path: 'join/:token', name: 'drills-join', component: () => import('@/pages/drills/JoinPage.vue'), props: true, meta: { public: true, title: 'Join a class' } },
      { path: 'progress', name: 'drills-progress', component: () => import('@/pages/drills/ProgressPage.vue'), meta: { title: 'My progress' } },
      { path: 'classes/:id', name: 'drills-class', component: () => import('@/pages/drills/ClassDeskPage.vue'), props: true, meta: { title: 'Class desk', roles: TEACHING_ROLES } },
      { path: 'puzzles/new', name: 'drills-puzzle-maker', component: () => import('@/pages/drills/PuzzleMakerPage.vue'), meta: { title: 'Puzzle maker', roles: TEACHING_ROLES } },
      { path: 'hunt/:assignmentId', name: 'drills-hunt', component: () => import('@/pages/drills/FaultHuntPage.vue'), props: true, meta: { title: 'Fault hunt' } },
      { path: 'demonstrations/new', name: 'drills-demo-builder', component: () => import('@/pages/drills/DemonstrationBuilderPage.vue'), meta: { title: 'Demonstration builder', roles: TEACHING_ROLES, fullBleed: true } },
      { path: 'demonstrations/:id/present', name: 'drills-projector', component: () => import('@/pages/drills/ProjectorPage.vue'), props: (r) => ({ id: r.params.id, source: 'own' }), meta: { title: 'Projector view', roles: TEACHING_ROLES, fullBleed: true } },
      { path: 'step-through/:id', name: 'drills-step-through', component: () => import('@/pages/drills/ProjectorPage.vue'), props: (r) => ({ id: r.params.id, source: 'assigned' }), meta: { title: 'Step-through', fullBleed: true } },
    ],
  },
  {
    path: '/account',
    name: 'account',
    component: () => import('@/pages/account/index.vue'),
    meta: { title: 'Account' },
  },
  {
    path: '/people',
    name: 'people',
    component: () => import('@/pages/people/index.vue'),
    meta: { title: 'People', roles: PEOPLE_ROLES },
  },
  {
    path: '/forbidden',
    name: 'forbidden',
    component: () => import('@/pages/errors/ForbiddenPage.vue'),
    meta: { public: true, title: 'Not for this account' },
  },
  {
    path: '/:pathMatch(.*)*',
    name: 'not-found',
    component: () => import('@/pages/errors/NotFoundPage.vue'),
    meta: { public: true, title: 'Page not found' },
  },
];
