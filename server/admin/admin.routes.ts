/**
 * Account administration: list and search users, change roles, disable, delete, send a reset, invite,
 * and read the audit log every one of these actions writes. Admins with a second factor only.
 */
import { Router, type Response } from 'express';
import { z } from 'zod';
import { AccountStatusSchema, InviteSchema, type AuditList } from '../../shared/schemas/account.schema';
import { RoleChangeSchema, UserListQuerySchema, type UserList } from '../../shared/schemas/auth.schema';
import type { AuthService } from '../auth/auth.service';
import type { SessionService } from '../auth/sessions';
import { currentUser, requireRole } from '../http/auth.middleware';
import { HttpError, notFound } from '../http/http-error';
import { parseBody, parseParams } from '../http/validate';
import { parseQuery } from '../http/validate';
import { toAdminUser, type UsersRepo } from '../users/users.repo';
import type { AuditRepo } from './audit.repo';

const UserIdParams = z.object({ id: z.string().min(1).max(64) });

export function adminRoutes(deps: {
  users: UsersRepo;
  audit: AuditRepo;
  auth: AuthService;
  sessions: SessionService;
}): Router {
  const { users, audit, auth, sessions } = deps;
  const router = Router();
  router.use(requireRole('admin'));

  const actor = (res: Response) => currentUser(res);
  /** Admins cannot lock themselves (and so possibly everyone) out of administration. */
  const notSelf = (id: string, res: Response, what: string) => {
    if (id === actor(res).id)
      throw new HttpError(403, 'FORBIDDEN', `You cannot ${what} your own account. Ask another admin.`);
  };
  const target = async (id: string) => {
    const row = await users.findById(id);
    if (!row) throw notFound('That user');
    return row;
  };

  router.get('/users', async (req, res) => {
    const query = parseQuery(UserListQuerySchema, req);
    const { items, total } = await users.list(query);
    res.json({ items, total, page: query.page, pageSize: query.pageSize } satisfies UserList);
  });

  router.patch('/users/:id', async (req, res) => {
    const { id } = parseParams(UserIdParams, req);
    const { role } = parseBody(RoleChangeSchema, req);
    if (id === actor(res).id && role !== 'admin') {
      throw new HttpError(403, 'FORBIDDEN', 'You cannot remove your own admin role. Ask another admin.');
    }
    const before = await target(id);
    const user = await users.setRole(id, role);
    if (!user) throw notFound('That user');
    await audit.write({
      actor: actor(res),
      action: 'role-changed',
      target: user,
      detail: `${before.role} → ${role}`,
    });
    res.json({ user });
  });

  router.patch('/users/:id/status', async (req, res) => {
    const { id } = parseParams(UserIdParams, req);
    const { disabled } = parseBody(AccountStatusSchema, req);
    notSelf(id, res, 'disable');
    await target(id);
    const user = await users.setDisabled(id, disabled);
    if (!user) throw notFound('That user');
    if (disabled) await sessions.endAll(id);
    await audit.write({
      actor: actor(res),
      action: disabled ? 'account-disabled' : 'account-enabled',
      target: user,
    });
    res.json({ user });
  });

  router.delete('/users/:id', async (req, res) => {
    const { id } = parseParams(UserIdParams, req);
    notSelf(id, res, 'delete');
    const row = await target(id);
    await users.delete(id);
    await audit.write({ actor: actor(res), action: 'account-deleted', target: row, detail: row.role });
    res.status(204).end();
  });

  router.post('/users/:id/password-reset', async (req, res) => {
    const { id } = parseParams(UserIdParams, req);
    const row = await target(id);
    await auth.sendReset(row);
    await audit.write({ actor: actor(res), action: 'password-reset-sent', target: row });
    res.status(202).end();
  });

  router.post('/invitations', async (req, res) => {
    const input = parseBody(InviteSchema, req);
    const user = await auth.invite(input);
    if (!user) {
      throw new HttpError(409, 'EMAIL_TAKEN', 'An account with that e-mail already exists.', {
        email: ['An account with that e-mail already exists'],
      });
    }
    await audit.write({ actor: actor(res), action: 'user-invited', target: user, detail: input.role });
    const row = await target(user.id);
    res.status(201).json({ user: toAdminUser(row) });
  });

  router.get('/audit', async (_req, res) => {
    res.json({ items: await audit.list() } satisfies AuditList);
  });

  return router;
}
