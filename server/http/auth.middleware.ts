/**
 * Who is asking: every /api request passes through `loadSession`, which puts the signed-in user (or
 * null) on `res.locals`. Routes then state who may use them with `requireUser` / `requireRole`.
 */
import type { RequestHandler, Response } from 'express';
import type { Lucia, Session } from 'lucia';
import type { Role, User } from '../../shared/schemas/auth.schema';
import { HttpError } from './http-error';

/** What the middleware needs from the session store; `server/auth` provides it, so http/ never imports auth/. */
export type SessionReader = Pick<
  Lucia,
  'readSessionCookie' | 'validateSession' | 'createBlankSessionCookie' | 'createSessionCookie'
>;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user: User | null;
      session: Session | null;
    }
  }
}

export function loadSession(lucia: SessionReader): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.session = null;
    const sessionId = lucia.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const { session, user } = await lucia.validateSession(sessionId);
    if (!session) {
      // Expired or signed out elsewhere: clear the stale cookie.
      res.appendHeader('Set-Cookie', lucia.createBlankSessionCookie().serialize());
      return next();
    }
    // lucia extends a session past half its lifetime; send the renewed expiry to the browser.
    if (session.fresh) res.appendHeader('Set-Cookie', lucia.createSessionCookie(session.id).serialize());
    res.locals.session = session;
    res.locals.user = { ...user };
    next();
  };
}

/** The signed-in user, or 401. */
export function currentUser(res: Response): User {
  const user = res.locals.user;
  if (!user) throw new HttpError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
  return user;
}

export const requireUser: RequestHandler = (_req, res, next) => {
  currentUser(res);
  next();
};

export function requireRole(...roles: Role[]): RequestHandler {
  return (_req, res, next) => {
    const user = currentUser(res);
    if (!roles.includes(user.role)) {
      throw new HttpError(403, 'FORBIDDEN', 'Your account does not have access to this.');
    }
    next();
  };
}
