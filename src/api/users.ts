import { z } from 'zod';
import { UserListSchema, UserSchema, type Role, type UserListQuery } from '@shared/schemas';
import { request, toQuery } from './client';

const UserAnswerSchema = z.object({ user: UserSchema });

export const usersApi = {
  list: (query: Partial<UserListQuery>) =>
    request('GET', `/api/admin/users${toQuery(query)}`, UserListSchema),
  changeRole: (id: string, role: Role) =>
    request('PATCH', `/api/admin/users/${encodeURIComponent(id)}`, UserAnswerSchema, { role }).then(
      (r) => r.user,
    ),
};
