/**
 * Cross-site request check for state-changing requests (POST, PUT, PATCH, DELETE).
 *
 * A browser always sends Origin on a cross-origin fetch and on form posts, so a request whose Origin
 * (or, failing that, Referer) names another site is refused with 403 BAD_ORIGIN. Only the configured
 * public origin is allowed: the Host header is chosen by whoever sends the request, so it proves nothing.
 * (In development the Vite proxy forwards the browser's Origin, which must then be PUBLIC_ORIGIN.)
 *
 * Requests with neither header come from non-browser clients (curl, the CLI, tests) and are let
 * through: they cannot carry a victim's cookie without the victim's browser, and the session cookie is
 * SameSite=Lax as a second line.
 */
import type { RequestHandler } from 'express';
import { HttpError } from './http-error';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(value: string): string | null {
  try {
    return new URL(value).origin;
  } catch {
    return null;
  }
}

export function originCheck(publicOrigin: string): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const claimed = req.headers.origin ?? req.headers.referer;
    if (claimed === undefined) return next();
    const origin = originOf(claimed);
    if (origin !== publicOrigin)
      throw new HttpError(403, 'BAD_ORIGIN', 'This request came from another site and was refused.');
    next();
  };
}
