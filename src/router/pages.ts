/**
 * The page components behind every route but the landing, and the app frame around them. The route table only
 * names them: the imports live here, with the list of files each page needs for its first paint, so a first
 * visit to the landing does not fetch that list. This module is fetched on the first navigation elsewhere.
 */
export const pages = {
  signIn: () => import('@/pages/sign-in/index.vue'),
  signUp: () => import('@/pages/sign-up/index.vue'),
  forgotPassword: () => import('@/pages/password/ForgotPasswordPage.vue'),
  resetPassword: () => import('@/pages/password/ResetPasswordPage.vue'),
  verifyEmail: () => import('@/pages/verify-email/index.vue'),
  plans: () => import('@/pages/plans/index.vue'),
  bench: () => import('@/pages/bench/index.vue'),
  workSheet: () => import('@/pages/work-sheet/index.vue'),
  sharedLink: () => import('@/pages/plans/SharedLinkPage.vue'),
  drills: () => import('@/pages/drills/index.vue'),
  drillsJoin: () => import('@/pages/drills/JoinPage.vue'),
  drillsProgress: () => import('@/pages/drills/ProgressPage.vue'),
  classDesk: () => import('@/pages/drills/ClassDeskPage.vue'),
  puzzleMaker: () => import('@/pages/drills/PuzzleMakerPage.vue'),
  faultHunt: () => import('@/pages/drills/FaultHuntPage.vue'),
  demonstrationBuilder: () => import('@/pages/drills/DemonstrationBuilderPage.vue'),
  projector: () => import('@/pages/drills/ProjectorPage.vue'),
  account: () => import('@/pages/account/index.vue'),
  people: () => import('@/pages/people/index.vue'),
  forbidden: () => import('@/pages/errors/ForbiddenPage.vue'),
  notFound: () => import('@/pages/errors/NotFoundPage.vue'),
};

export type PageName = keyof typeof pages;

/** naive-ui's providers and the app layout, around every page but the landing. */
export const appFrame = () => import('@/AppFrame.vue');
