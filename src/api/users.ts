import { z } from 'zod';
import {
  AdminUserSchema,
  AuditListSchema,
  UserListSchema,
  type Invite,
  type Role,
  type UserListQuery,
} from '@shared/schemas';
import { request, toQuery } from './client';

const AdminUserAnswerSchema = z.object({ user: AdminUserSchema });
const user = (id: string) => `/api/admin/users/${encodeURIComponent(id)}`;

export const usersApi = {
  list: (query: Partial<UserListQuery>) =>
    request('GET', `/api/admin/users${toQuery(query)}`, UserListSchema),
  changeRole: (id: string, role: Role) =>
    request('PATCH', user(id), AdminUserAnswerSchema, { role }).then((r) => r.user),
  setDisabled: (id: string, disabled: boolean) =>
    request('PATCH', `${user(id)}/status`, AdminUserAnswerSchema, { disabled }).then((r) => r.user),
  remove: (id: string) => request('DELETE', user(id), null),
  sendReset: (id: string) => request('POST', `${user(id)}/password-reset`, null),
  invite: (input: Invite) =>
    request('POST', '/api/admin/invitations', AdminUserAnswerSchema, input).then((r) => r.user),
  audit: () => request('GET', '/api/admin/audit', AuditListSchema).then((r) => r.items),
};
