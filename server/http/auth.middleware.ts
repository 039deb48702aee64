/**
 * Who is asking: every /api request passes through `loadSession`, which puts the signed-in user (or
 * null) on `res.locals`. Routes then state who may use them with `requireUser` / `requireRole`.
 */
import type { RequestHandler, Response } from 'express';
import type { Role, User } from '../../shared/schemas/auth.schema';
import { HttpError } from './http-error';

export interface ActiveSession {
  /** The stored handle (hash of the cookie value). */
  id: string;
  userId: string;
  /** Password checked, TOTP code still owed: the user is not signed in yet. */
  pendingSecondFactor: boolean;
  totpEnabled: boolean;
  mustChangePassword: boolean;
}

/** What the middleware needs from the session store; `server/auth` provides it, so http/ never imports auth/. */
export interface SessionReader {
  readToken(cookieHeader: string): string | null;
  validate(token: string): Promise<{ session: ActiveSession; user: User } | null>;
  clearCookie(res: Response): void;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      /** Set only for a fully signed-in session. */
      user: User | null;
      session: ActiveSession | null;
    }
  }
}

export function loadSession(sessions: SessionReader): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.session = null;
    const token = sessions.readToken(req.headers.cookie ?? '');
    if (!token) return next();
    const found = await sessions.validate(token);
    if (!found) {
      // Expired, idle too long, disabled or signed out elsewhere: clear the stale cookie.
      sessions.clearCookie(res);
      return next();
    }
    res.locals.session = found.session;
    if (!found.session.pendingSecondFactor) res.locals.user = found.user;
    next();
  };
}

/** The signed-in user, or 401. */
export function currentUser(res: Response): User {
  const user = res.locals.user;
  if (!user) throw new HttpError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
  return user;
}

/** Signed in, even with a password that must be changed first (for the routes that change it). */
export const requireSignedIn: RequestHandler = (_req, res, next) => {
  currentUser(res);
  next();
};

export const requireUser: RequestHandler = (_req, res, next) => {
  currentUser(res);
  if (res.locals.session?.mustChangePassword) {
    throw new HttpError(403, 'PASSWORD_CHANGE_REQUIRED', 'Choose a new password before you continue.');
  }
  next();
};

/** The given roles only; admins must also have a second factor (OWASP ASVS 4.0.3 V2.8, V4.3.1). */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, res, next) => {
    requireUser(req, res, () => undefined);
    const user = currentUser(res);
    if (!roles.includes(user.role)) {
      throw new HttpError(403, 'FORBIDDEN', 'Your account does not have access to this.');
    }
    if (user.role === 'admin' && roles.includes('admin') && !res.locals.session?.totpEnabled) {
      throw new HttpError(
        403,
        'SECOND_FACTOR_REQUIRED',
        'Set up an authenticator app on your Account page before using administration.',
      );
    }
    next();
  };
}
