/** Sign-up, sign-in, sign-out, the current session and password change. */
import { Router, type Response } from 'express';
import {
  ChangePasswordSchema,
  SignInSchema,
  SignUpSchema,
  type SessionInfo,
  type User,
} from '../../shared/schemas/auth.schema';
import { authRateLimit, type RateLimitOptions } from '../http/rate-limit';
import { parseBody } from '../http/validate';
import { currentUser, requireUser } from '../http/auth.middleware';
import type { AuthService } from './auth.service';
import type { AppLucia } from './lucia';

export function authRoutes(auth: AuthService, lucia: AppLucia, rateLimit: RateLimitOptions): Router {
  const router = Router();
  // One budget for sign-in and sign-up together, per client address.
  const limiter = authRateLimit(rateLimit);

  async function startSession(res: Response, user: User): Promise<void> {
    const session = await lucia.createSession(user.id, {});
    res.appendHeader('Set-Cookie', lucia.createSessionCookie(session.id).serialize());
  }

  /** Ends the session this request came with, if any; a following `startSession` replaces the cookie. */
  async function dropCurrentSession(res: Response): Promise<void> {
    if (res.locals.session) await lucia.invalidateSession(res.locals.session.id);
  }

  router.post('/sign-up', limiter, async (req, res) => {
    const input = parseBody(SignUpSchema, req);
    const user = await auth.signUp(input);
    await dropCurrentSession(res);
    await startSession(res, user);
    res.status(201).json({ user } satisfies SessionInfo);
  });

  router.post('/sign-in', limiter, async (req, res) => {
    const input = parseBody(SignInSchema, req);
    const user = await auth.signIn(input);
    // A new session id on every sign-in, so an id planted before sign-in is worthless.
    await dropCurrentSession(res);
    await startSession(res, user);
    res.json({ user } satisfies SessionInfo);
  });

  router.post('/sign-out', async (_req, res) => {
    await dropCurrentSession(res);
    res.appendHeader('Set-Cookie', lucia.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  router.get('/session', (_req, res) => {
    res.json({ user: res.locals.user } satisfies SessionInfo);
  });

  router.post('/password', requireUser, async (req, res) => {
    const input = parseBody(ChangePasswordSchema, req);
    const user = currentUser(res);
    await auth.changePassword(user.id, input);
    // Every other device is signed out; this one gets a fresh session.
    await lucia.invalidateUserSessions(user.id);
    await startSession(res, user);
    res.status(204).end();
  });

  return router;
}
