import type { Role } from '@shared/schemas';

/** Where each role lands after signing in. */
export const ROLE_HOME: Record<Role, string> = {
  restorer: '/plans',
  instructor: '/plans',
  trainee: '/drills',
  admin: '/people',
};

/** Accept only same-site paths for `?next=`, so a link cannot send people elsewhere after sign-in. */
export function safeNext(next: unknown): string | null {
  if (typeof next !== 'string') return null;
  if (!next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  return next;
}
