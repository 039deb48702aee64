/** Sessions: lucia over our Knex adapter, with the cookie settings from the config. */
import { Lucia, TimeSpan } from 'lucia';
import type { Role } from '../../shared/schemas/auth.schema';
import type { Database } from '../db/database';
import { KnexAdapter } from './knex-adapter';

export const SESSION_COOKIE = 'leadbench_session';

export function createLucia(db: Database, config: { sessionDays: number; sessionSecure: boolean }) {
  return new Lucia(new KnexAdapter(db), {
    sessionExpiresIn: new TimeSpan(config.sessionDays, 'd'),
    sessionCookie: {
      name: SESSION_COOKIE,
      // lucia always marks the cookie HttpOnly; SameSite=Lax keeps it off cross-site form posts.
      attributes: { secure: config.sessionSecure, sameSite: 'lax', path: '/' },
    },
    getUserAttributes: (a) => ({
      email: a.email,
      displayName: a.display_name,
      role: a.role,
      createdAt: a.created_at,
    }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: { email: string; display_name: string; role: Role; created_at: string };
  }
}
