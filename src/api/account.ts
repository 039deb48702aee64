import { z } from 'zod';
import {
  AccountExportSchema,
  AccountSchema,
  SessionListSchema,
  TotpEnrolmentSchema,
  type DeleteAccount,
  type ProfileUpdate,
  type TotpCode,
} from '@shared/schemas';
import { request } from './client';

const ProfileAnswerSchema = z.object({ account: AccountSchema, emailPending: z.boolean() });
const EndedSchema = z.object({ ended: z.number().int() });
const session = (id: string) => `/api/account/sessions/${encodeURIComponent(id)}`;

export const accountApi = {
  get: () => request('GET', '/api/account', AccountSchema),
  /** A new e-mail address applies once confirmed from the mail; `emailPending` says one was sent. */
  update: (input: ProfileUpdate) => request('PATCH', '/api/account', ProfileAnswerSchema, input),
  remove: (input: DeleteAccount) => request('DELETE', '/api/account', null, input),
  exportData: () => request('GET', '/api/account/export', AccountExportSchema),
  sessions: () => request('GET', '/api/account/sessions', SessionListSchema).then((r) => r.items),
  endSession: (id: string) => request('DELETE', session(id), null),
  signOutOthers: () =>
    request('POST', '/api/account/sessions/sign-out-others', EndedSchema).then((r) => r.ended),
  startTotp: () => request('POST', '/api/account/totp', TotpEnrolmentSchema),
  confirmTotp: (input: TotpCode) => request('POST', '/api/account/totp/confirm', null, input),
};
