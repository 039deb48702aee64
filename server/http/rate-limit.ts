/** Request budgets (per address or per account); they answer in our error shape. */
import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { sendError } from './error-handler';

export interface RateLimitOptions {
  windowMs: number;
  limit: number;
}

export function authRateLimit(options: RateLimitOptions) {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      sendError(res, 429, 'RATE_LIMITED', 'Too many attempts. Wait a few minutes and try again.');
    },
  });
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Writes (POST, PUT, PATCH, DELETE) per signed-in account per window. Requests without a user are left
 * to the route, which answers 401.
 */
export function accountWriteLimit(
  limit: number,
  windowMs = 60_000,
  message = 'Too many changes in a short time.',
) {
  const minutes = Math.max(1, Math.round(windowMs / 60_000));
  const limiter = rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skip: (_req, res) => !res.locals.user,
    keyGenerator: (_req, res) => `user:${res.locals.user!.id}`,
    handler: (_req, res) => {
      sendError(
        res,
        429,
        'RATE_LIMITED',
        `${message} Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`,
      );
    },
  });
  // Reads never count; they skip the limiter before it does any work (it sits in front of every plan read).
  const limitWrites: RequestHandler = (req, res, next) =>
    SAFE_METHODS.has(req.method) ? next() : limiter(req, res, next);
  return limitWrites;
}
