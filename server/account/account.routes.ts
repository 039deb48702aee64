/** The signed-in person's own account: profile, sessions, second factor, data export, deletion. */
import { Router } from 'express';
import { z } from 'zod';
import {
  DeleteAccountSchema,
  ProfileUpdateSchema,
  TotpCodeSchema,
  type AccountExport,
  type SessionList,
} from '../../shared/schemas/account.schema';
import type { PlanRecord } from '../../shared/schemas/plans.schema';
import type { AuthService } from '../auth/auth.service';
import type { SessionService } from '../auth/sessions';
import { currentUser, requireSignedIn } from '../http/auth.middleware';
import { notFound } from '../http/http-error';
import { parseBody, parseParams } from '../http/validate';
import type { PlansRepo } from '../plans/plans.repo';
import { viewerOf } from '../plans/plans.service';
import { toAccount, type UsersRepo } from '../users/users.repo';

const SessionParams = z.object({ id: z.string().regex(/^[0-9a-f]{64}$/, 'Not a session') });

export function accountRoutes(deps: {
  auth: AuthService;
  sessions: SessionService;
  users: UsersRepo;
  plans: PlansRepo;
}): Router {
  const { auth, sessions, users, plans } = deps;
  const router = Router();
  // Signed in, even before a required password change, so the Account page can show why.
  router.use(requireSignedIn);

  const account = async (userId: string) => {
    const row = await users.findById(userId);
    if (!row) throw notFound('That account');
    return toAccount(row);
  };

  router.get('/', async (_req, res) => {
    res.json(await account(currentUser(res).id));
  });

  router.patch('/', async (req, res) => {
    const input = parseBody(ProfileUpdateSchema, req);
    const { id } = currentUser(res);
    const { emailPending } = await auth.updateProfile(id, input);
    res.json({ account: await account(id), emailPending });
  });

  router.delete('/', async (req, res) => {
    const { password } = parseBody(DeleteAccountSchema, req);
    await auth.deleteAccount(currentUser(res).id, password);
    sessions.clearCookie(res);
    res.status(204).end();
  });

  router.get('/export', async (_req, res) => {
    const user = currentUser(res);
    const { id } = user;
    const records: PlanRecord[] = await plans.ownRecords(viewerOf(user));
    const body: AccountExport = {
      exportedAt: new Date().toISOString(),
      account: await account(id),
      plans: records,
    };
    res.attachment('leadbench-account.json').json(body);
  });

  router.get('/sessions', async (_req, res) => {
    const body: SessionList = {
      items: await sessions.list(currentUser(res).id, res.locals.session?.id ?? null),
    };
    res.json(body);
  });

  router.delete('/sessions/:id', async (req, res) => {
    const { id } = parseParams(SessionParams, req);
    if (!(await sessions.endOne(id, currentUser(res).id))) throw notFound('That session');
    res.status(204).end();
  });

  /** "Sign out everywhere else". */
  router.post('/sessions/sign-out-others', async (_req, res) => {
    const ended = await sessions.endAll(currentUser(res).id, res.locals.session?.id);
    res.json({ ended });
  });

  /** Starts TOTP enrolment: a new secret, active once a code from it is confirmed. */
  router.post('/totp', async (_req, res) => {
    res.json(await auth.startTotpEnrolment(currentUser(res)));
  });

  router.post('/totp/confirm', async (req, res) => {
    const { code } = parseBody(TotpCodeSchema, req);
    const { id } = currentUser(res);
    await auth.checkTotp(id, code, req.ip ?? 'unknown');
    await auth.enableTotp(id);
    res.status(204).end();
  });

  return router;
}
