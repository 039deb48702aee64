/** Account administration: list and search users, change roles. Admins only. */
import { Router } from 'express';
import { z } from 'zod';
import { RoleChangeSchema, UserListQuerySchema, type UserList } from '../../shared/schemas/auth.schema';
import { currentUser, requireRole } from '../http/auth.middleware';
import { HttpError, notFound } from '../http/http-error';
import { parseBody, parseParams, parseQuery } from '../http/validate';
import type { UsersRepo } from '../users/users.repo';

const UserIdParams = z.object({ id: z.string().min(1).max(64) });

export function adminRoutes(users: UsersRepo): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/users', async (req, res) => {
    const query = parseQuery(UserListQuerySchema, req);
    const { items, total } = await users.list(query);
    res.json({ items, total, page: query.page, pageSize: query.pageSize } satisfies UserList);
  });

  router.patch('/users/:id', async (req, res) => {
    const { id } = parseParams(UserIdParams, req);
    const { role } = parseBody(RoleChangeSchema, req);
    if (id === currentUser(res).id && role !== 'admin') {
      // Otherwise the last admin could lock everyone out of administration.
      throw new HttpError(403, 'FORBIDDEN', 'You cannot remove your own admin role. Ask another admin.');
    }
    const user = await users.setRole(id, role);
    if (!user) throw notFound('That user');
    res.json({ user });
  });

  return router;
}
