/** Sessions table: rows are keyed by the SHA-256 of the session id, so a leaked table signs nobody in. */
import type { Database } from '../db/database';
import { preparedRead } from '../db/prepared';
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

interface SessionWithUserRow extends UserRow {
  s_created_at: number;
  s_last_used_at: number;
  s_expires_at: number;
  s_user_agent: string;
  s_pending_second_factor: number;
}

export function sessionsRepo(db: Database) {
  const withUser = preparedRead<SessionWithUserRow>(
    db,
    `select sessions.created_at as s_created_at, sessions.last_used_at as s_last_used_at,
       sessions.expires_at as s_expires_at, sessions.user_agent as s_user_agent,
       sessions.pending_second_factor as s_pending_second_factor, users.*
     from sessions join users on users.id = sessions.user_id
     where sessions.id = ?`,
  );

  return {
    async insert(row: SessionRow): Promise<void> {
      await db('sessions').insert(row);
    },

    /** One query per request, prepared once: the session and its account together. */
    async findWithUser(id: string): Promise<{ session: SessionRow; user: UserRow } | null> {
      const row = await withUser.get(id);
      if (!row) return null;
      const { s_created_at, s_last_used_at, s_expires_at, s_user_agent, s_pending_second_factor, ...user } =
        row;
      return {
        session: {
          id,
          user_id: user.id,
          created_at: s_created_at,
          last_used_at: s_last_used_at,
          expires_at: s_expires_at,
          user_agent: s_user_agent,
          pending_second_factor: s_pending_second_factor,
        },
        user,
      };
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
