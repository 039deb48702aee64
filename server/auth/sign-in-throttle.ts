/**
 * Failed sign-in throttling per account and per client address (OWASP ASVS 4.0.3 V2.2.1).
 * Only failures count, so a classroom signing in from one address is never slowed by its own
 * successes. A blocked caller is told the real wait. Reusable by any route that checks a secret.
 */
import { HttpError } from '../http/http-error';
import type { Database } from '../db/database';
import { signInThrottleRepo } from './sign-in-throttle.repo';

export interface ThrottleOptions {
  windowMs: number;
  perAccount: number;
  perAddress: number;
}

export const accountKey = (email: string): string => `account:${email.toLowerCase()}`;
export const addressKey = (address: string): string => `address:${address}`;

/** "7 minutes", "1 minute", "30 seconds". */
export function waitWords(ms: number): string {
  if (ms < 60_000) {
    const s = Math.max(1, Math.ceil(ms / 1000));
    return `${s} second${s === 1 ? '' : 's'}`;
  }
  const m = Math.ceil(ms / 60_000);
  return `${m} minute${m === 1 ? '' : 's'}`;
}

export class ThrottledError extends HttpError {
  constructor(readonly retryAfterMs: number) {
    super(429, 'RATE_LIMITED', `Too many failed sign-ins. Try again in ${waitWords(retryAfterMs)}.`);
  }
}

export function signInThrottle(db: Database, options: ThrottleOptions) {
  const repo = signInThrottleRepo(db);
  const limitOf = (key: string) => (key.startsWith('account:') ? options.perAccount : options.perAddress);

  return {
    /** Throws ThrottledError when any key has used up its failures in the current window. */
    async check(keys: string[]): Promise<void> {
      const now = Date.now();
      let wait = 0;
      for (const row of await repo.find(keys)) {
        const ends = Number(row.window_started_at) + options.windowMs;
        if (ends > now && row.failures >= limitOf(row.key)) wait = Math.max(wait, ends - now);
      }
      if (wait > 0) throw new ThrottledError(wait);
    },
    recordFailure: (keys: string[]) => repo.add(keys, Date.now(), options.windowMs),
    /** After a success: the account's own counter starts again; the address counter stays. */
    clear: (key: string) => repo.clear(key),
  };
}

export type SignInThrottle = ReturnType<typeof signInThrottle>;
