/** Limits repeated sign-in and sign-up attempts from one address; answers in our error shape. */
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
