import {
  SessionInfoSchema,
  type ChangePassword,
  type ForgotPassword,
  type ResetPassword,
  type SignIn,
  type SignUp,
  type TotpCode,
} from '@shared/schemas';
import { request } from './client';

export const authApi = {
  session: () => request('GET', '/api/auth/session', SessionInfoSchema).then((r) => r.user),
  /** A user, or `secondFactorRequired` when the account has TOTP and the code is still owed. */
  signIn: (input: SignIn) => request('POST', '/api/auth/sign-in', SessionInfoSchema, input),
  /** A user, or `verificationSent` when e-mail verification is on and no session was started. */
  signUp: (input: SignUp) => request('POST', '/api/auth/sign-up', SessionInfoSchema, input),
  secondFactor: (input: TotpCode) => request('POST', '/api/auth/second-factor', SessionInfoSchema, input),
  signOut: () => request('POST', '/api/auth/sign-out', null),
  changePassword: (input: ChangePassword) => request('POST', '/api/auth/password', null, input),
  verifyEmail: (token: string) => request('POST', '/api/auth/verify-email', null, { token }),
  forgotPassword: (input: ForgotPassword) => request('POST', '/api/auth/forgot-password', null, input),
  resetPassword: (input: ResetPassword) => request('POST', '/api/auth/reset-password', null, input),
};
