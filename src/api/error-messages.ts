/** Plain words for API failures; forms add field messages from `details` themselves. */
import { ApiError } from './client';

const MESSAGES: Partial<Record<ApiError['code'], string>> = {
  BAD_CREDENTIALS: 'E-mail or password is wrong.',
  EMAIL_TAKEN: 'An account with this e-mail already exists. Sign in instead.',
  RATE_LIMITED: 'Too many attempts in a short time. Wait a minute, then try again.',
  NETWORK: 'Leadbench cannot reach its server. Check your connection and try again.',
  UNAUTHENTICATED: 'Your session has ended. Sign in again to continue.',
  FORBIDDEN: 'Your account is not allowed to do that.',
  NOT_FOUND: 'That item no longer exists.',
  CONFLICT: 'Someone changed this in another tab or device. Reload to see the newest version.',
  PAYLOAD_TOO_LARGE: 'That is too large to save.',
  BAD_ORIGIN: 'The request came from an unexpected page. Reload Leadbench and try again.',
  INTERNAL: 'Something went wrong on the server. Try again in a moment.',
};

export function describeApiError(error: unknown): string {
  if (error instanceof ApiError) return MESSAGES[error.code] ?? error.message;
  return 'Something unexpected went wrong. Reload the page and try again.';
}
