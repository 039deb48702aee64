/**
 * Cross-site request check for state-changing requests (POST, PUT, PATCH, DELETE).
 *
 * A browser always sends Origin on a cross-origin fetch and on form posts, so a request whose Origin
 * (or, failing that, Referer) names another site is refused with 403 BAD_ORIGIN. Allowed are the
 * configured public origin and the origin the request itself was addressed to (its Host header), which
 * covers the Vite dev proxy and 127.0.0.1 vs localhost.
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
    const host = req.headers.host;
    const allowed =
      origin !== null &&
      (origin === publicOrigin || (host !== undefined && new URL(origin).host === host.toLowerCase()));
    if (!allowed)
      throw new HttpError(403, 'BAD_ORIGIN', 'This request came from another site and was refused.');
    next();
  };
}
