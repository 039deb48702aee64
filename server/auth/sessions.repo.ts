/** Sessions table: rows are keyed by the SHA-256 of the session id, so a leaked table signs nobody in. */
import type { Database } from '../db/database';
import type { UserRow } from '../users/users.repo';

export interface SessionRow {
  id: string;
  user_id: string;
  created_at: number;
  last_used_at: number;
  expires_at: number;
  user_agent: string;
  pending_second_factor: number | boolean;
}

export function sessionsRepo(db: Database) {
  return {
    async insert(row: SessionRow): Promise<void> {
      await db('sessions').insert(row);
    },

    async findWithUser(id: string): Promise<{ session: SessionRow; user: UserRow } | null> {
      const session = await db<SessionRow>('sessions').where({ id }).first();
      if (!session) return null;
      const user = await db<UserRow>('users').where({ id: session.user_id }).first();
      return user ? { session, user } : null;
    },

    async touch(id: string, at: number): Promise<void> {
      await db('sessions').where({ id }).update({ last_used_at: at });
    },

    async listForUser(userId: string): Promise<SessionRow[]> {
      return db<SessionRow>('sessions')
        .where({ user_id: userId, pending_second_factor: false })
        .orderBy('last_used_at', 'desc');
    },

    async delete(id: string): Promise<void> {
      await db('sessions').where({ id }).delete();
    },

    /** Deletes one of the user's sessions by its handle; false when it is not theirs. */
    async deleteForUser(id: string, userId: string): Promise<boolean> {
      return (await db('sessions').where({ id, user_id: userId }).delete()) > 0;
    },

    async deleteAllForUser(userId: string, exceptId?: string): Promise<number> {
      return db('sessions')
        .where({ user_id: userId })
        .modify((q) => {
          if (exceptId) q.whereNot({ id: exceptId });
        })
        .delete();
    },

    async deleteExpired(now: number, idleMs: number): Promise<void> {
      await db('sessions')
        .where('expires_at', '<=', now)
        .orWhere('last_used_at', '<=', now - idleMs)
        .delete();
    },
  };
}

export type SessionsRepo = ReturnType<typeof sessionsRepo>;
