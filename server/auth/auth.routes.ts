/**
 * Sign-up, sign-in (with its second factor), sign-out, the current session, password change and the
 * mail-link endpoints (verify, forgot, reset). Public unless marked.
 */
import { Router, type Request, type Response } from 'express';
import { ForgotPasswordSchema, TokenBodySchema, TotpCodeSchema } from '../../shared/schemas/account.schema';
import { SignInSchema, type SessionInfo } from '../../shared/schemas/auth.schema';
import {
  StrongChangePasswordSchema,
  StrongResetPasswordSchema,
  StrongSignUpSchema,
} from '../../shared/schemas/password-strength';
import { currentUser, requireSignedIn } from '../http/auth.middleware';
import { HttpError } from '../http/http-error';
import { accountWriteLimit, authRateLimit, type RateLimitOptions } from '../http/rate-limit';
import { parseBody } from '../http/validate';
import type { AuthService } from './auth.service';
import type { SessionService } from './sessions';

export function authRoutes(auth: AuthService, sessions: SessionService, rateLimit: RateLimitOptions): Router {
  const router = Router();
  // Sign-up and the mail-sending routes share one budget per client address. Sign-in is throttled by
  // failures only (see sign-in-throttle.ts).
  const limiter = authRateLimit(rateLimit);
  const passwordLimit = accountWriteLimit(5, 15 * 60_000, 'Too many password changes.');

  const address = (req: Request) => req.ip ?? 'unknown';

  /** Ends the session this request came with, if any; a following `start` replaces the cookie. */
  async function dropCurrentSession(res: Response): Promise<void> {
    if (res.locals.session) await sessions.end(res.locals.session.id);
  }

  router.post('/sign-up', limiter, async (req, res) => {
    const input = parseBody(StrongSignUpSchema, req);
    const user = await auth.signUp(input);
    if (!user) {
      res.status(202).json({ user: null, verificationSent: true } satisfies SessionInfo);
      return;
    }
    await dropCurrentSession(res);
    await sessions.start(res, user, { userAgent: req.get('user-agent') });
    res.status(201).json({ user } satisfies SessionInfo);
  });

  router.post('/sign-in', async (req, res) => {
    const input = parseBody(SignInSchema, req);
    const { user, row } = await auth.signIn(input, address(req));
    // A new session id on every sign-in, so an id planted before sign-in is worthless.
    await dropCurrentSession(res);
    const pending = row.totp_enabled_at !== null;
    await sessions.start(res, user, { userAgent: req.get('user-agent'), pendingSecondFactor: pending });
    if (pending) {
      res.json({ user: null, secondFactorRequired: true } satisfies SessionInfo);
      return;
    }
    await auth.recordSignIn(user.id);
    const mustChangePassword = Boolean(row.must_change_password);
    res.json({ user, ...(mustChangePassword ? { mustChangePassword } : {}) } satisfies SessionInfo);
  });

  /** The TOTP code after a password sign-in. */
  router.post('/second-factor', async (req, res) => {
    const session = res.locals.session;
    if (!session?.pendingSecondFactor)
      throw new HttpError(401, 'UNAUTHENTICATED', 'Sign in with your password first.');
    const { code } = parseBody(TotpCodeSchema, req);
    await auth.checkTotp(session.userId, code, address(req));
    // A fresh id once fully signed in.
    await sessions.end(session.id);
    const found = await sessions.validateUser(session.userId);
    await sessions.start(res, found, { userAgent: req.get('user-agent') });
    await auth.recordSignIn(found.id);
    res.json({ user: found } satisfies SessionInfo);
  });

  router.post('/sign-out', async (_req, res) => {
    await dropCurrentSession(res);
    sessions.clearCookie(res);
    res.status(204).end();
  });

  router.get('/session', (_req, res) => {
    const session = res.locals.session;
    res.json({
      user: res.locals.user,
      ...(session?.pendingSecondFactor ? { secondFactorRequired: true } : {}),
      ...(res.locals.user && session?.mustChangePassword ? { mustChangePassword: true } : {}),
    } satisfies SessionInfo);
  });

  router.post('/password', requireSignedIn, passwordLimit, async (req, res) => {
    const input = parseBody(StrongChangePasswordSchema, req);
    const user = currentUser(res);
    await auth.changePassword(user.id, input);
    // Every other device is signed out; this one gets a fresh session.
    await sessions.endAll(user.id);
    await sessions.start(res, user, { userAgent: req.get('user-agent') });
    res.status(204).end();
  });

  router.post('/verify-email', async (req, res) => {
    const { token } = parseBody(TokenBodySchema, req);
    await auth.verifyEmail(token);
    res.status(204).end();
  });

  router.post('/forgot-password', limiter, async (req, res) => {
    const { email } = parseBody(ForgotPasswordSchema, req);
    await auth.forgotPassword(email);
    // The same answer whether or not the address has an account.
    res.status(202).end();
  });

  router.post('/reset-password', limiter, async (req, res) => {
    const input = parseBody(StrongResetPasswordSchema, req);
    const userId = await auth.resetPassword(input);
    await sessions.endAll(userId);
    sessions.clearCookie(res);
    res.status(204).end();
  });

  return router;
}
