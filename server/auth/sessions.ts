/**
 * Sign-in sessions (OWASP ASVS 4.0.3 V3): a 256-bit random id in an HttpOnly, SameSite=Lax cookie
 * (`__Host-` prefixed and Secure over https), stored only as its SHA-256, ended by an absolute lifetime
 * and by an idle timeout, listed and revocable by their owner.
 */
import { createHash, randomBytes } from 'node:crypto';
import type { CookieOptions, Response } from 'express';
import type { SessionEntry } from '../../shared/schemas/account.schema';
import type { User } from '../../shared/schemas/auth.schema';
import type { ActiveSession, SessionReader } from '../http/auth.middleware';
import { HttpError } from '../http/http-error';
import { toUser, type UsersRepo } from '../users/users.repo';
import type { SessionsRepo, SessionRow } from './sessions.repo';
import { deviceName } from './device-name';

export const SESSION_COOKIE = 'leadbench_session';
/** The `__Host-` prefix makes browsers refuse the cookie unless Secure, host-only and Path=/ (RFC 6265bis §4.1.3.2). */
export const SECURE_SESSION_COOKIE = `__Host-${SESSION_COOKIE}`;

/** A busy tab does not write on every request: last use is recorded at most once a minute. */
const TOUCH_EVERY_MS = 60_000;

export interface SessionPolicy {
  absoluteHours: number;
  idleHours: number;
  secure: boolean;
}

export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');
export const newToken = (): string => randomBytes(32).toString('base64url');

export function sessionService(repo: SessionsRepo, users: UsersRepo, policy: SessionPolicy) {
  const cookieName = policy.secure ? SECURE_SESSION_COOKIE : SESSION_COOKIE;
  const absoluteMs = policy.absoluteHours * 3_600_000;
  const idleMs = policy.idleHours * 3_600_000;
  const cookieOptions: CookieOptions = {
    httpOnly: true,
    sameSite: 'lax',
    secure: policy.secure,
    path: '/',
  };

  const isLive = (row: SessionRow, now: number) => row.expires_at > now && row.last_used_at + idleMs > now;

  const reader: SessionReader = {
    readToken(cookieHeader) {
      for (const part of cookieHeader.split(';')) {
        const eq = part.indexOf('=');
        if (eq > 0 && part.slice(0, eq).trim() === cookieName) return part.slice(eq + 1).trim() || null;
      }
      return null;
    },
    async validate(token) {
      const id = hashToken(token);
      const found = await repo.findWithUser(id);
      const now = Date.now();
      if (!found || !isLive(found.session, now) || found.user.disabled_at !== null) {
        if (found) await repo.delete(id);
        return null;
      }
      if (now - found.session.last_used_at > TOUCH_EVERY_MS) await repo.touch(id, now);
      const session: ActiveSession = {
        id,
        userId: found.user.id,
        pendingSecondFactor: Boolean(found.session.pending_second_factor),
        totpEnabled: found.user.totp_enabled_at !== null,
        mustChangePassword: Boolean(found.user.must_change_password),
      };
      return { session, user: toUser(found.user) };
    },
    clearCookie(res) {
      res.cookie(cookieName, '', { ...cookieOptions, maxAge: 0 });
    },
  };

  return {
    ...reader,
    cookieName,

    /** Starts a session and sets its cookie. The cookie lives until the absolute end. */
    async start(
      res: Response,
      user: User,
      options: { userAgent?: string; pendingSecondFactor?: boolean } = {},
    ): Promise<string> {
      const token = newToken();
      const now = Date.now();
      await repo.insert({
        id: hashToken(token),
        user_id: user.id,
        created_at: now,
        last_used_at: now,
        expires_at: now + absoluteMs,
        user_agent: (options.userAgent ?? '').slice(0, 200),
        pending_second_factor: options.pendingSecondFactor ?? false,
      });
      res.cookie(cookieName, token, { ...cookieOptions, maxAge: absoluteMs });
      return hashToken(token);
    },

    /** The account behind a session, freshly read (after a second factor). */
    async validateUser(userId: string): Promise<User> {
      const row = await users.findById(userId);
      if (!row || row.disabled_at) throw new HttpError(401, 'UNAUTHENTICATED', 'Sign in to continue.');
      return toUser(row);
    },

    async end(id: string): Promise<void> {
      await repo.delete(id);
    },

    async list(userId: string, currentId: string | null): Promise<SessionEntry[]> {
      const now = Date.now();
      return (await repo.listForUser(userId))
        .filter((row) => isLive(row, now))
        .map((row) => ({
          id: row.id,
          createdAt: new Date(Number(row.created_at)).toISOString(),
          lastUsedAt: new Date(Number(row.last_used_at)).toISOString(),
          expiresAt: new Date(
            Math.min(Number(row.expires_at), Number(row.last_used_at) + idleMs),
          ).toISOString(),
          userAgent: row.user_agent,
          device: deviceName(row.user_agent),
          current: row.id === currentId,
        }));
    },

    endOne: (id: string, userId: string) => repo.deleteForUser(id, userId),
    /** Signs the user out everywhere, or everywhere but `exceptId`. */
    endAll: (userId: string, exceptId?: string) => repo.deleteAllForUser(userId, exceptId),
    sweep: () => repo.deleteExpired(Date.now(), idleMs),
  };
}

export type SessionService = ReturnType<typeof sessionService>;
