import { z } from 'zod';
import {
  SessionInfoSchema,
  UserSchema,
  type ChangePassword,
  type SignIn,
  type SignUp,
} from '@shared/schemas';
import { request } from './client';

const UserAnswerSchema = z.object({ user: UserSchema });

export const authApi = {
  session: () => request('GET', '/api/auth/session', SessionInfoSchema).then((r) => r.user),
  signIn: (input: SignIn) =>
    request('POST', '/api/auth/sign-in', UserAnswerSchema, input).then((r) => r.user),
  signUp: (input: SignUp) =>
    request('POST', '/api/auth/sign-up', UserAnswerSchema, input).then((r) => r.user),
  signOut: () => request('POST', '/api/auth/sign-out', null),
  changePassword: (input: ChangePassword) => request('POST', '/api/auth/password', null, input),
};
