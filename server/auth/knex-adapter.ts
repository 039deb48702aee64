/**
 * lucia's session storage over our own Knex connection, so sessions and users go through the one
 * data layer. Keeping it this small makes lucia (in maintenance upstream) easy to swap later.
 */
import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import type { Database } from '../db/database';
import type { UserRow } from '../users/users.repo';

interface SessionRow {
  id: string;
  user_id: string;
  expires_at: number;
}

const toDatabaseSession = (row: SessionRow): DatabaseSession => ({
  id: row.id,
  userId: row.user_id,
  expiresAt: new Date(Number(row.expires_at)),
  attributes: {},
});

const toDatabaseUser = (row: UserRow): DatabaseUser => ({
  id: row.id,
  attributes: {
    email: row.email,
    display_name: row.display_name,
    role: row.role,
    created_at: row.created_at,
  },
});

export class KnexAdapter implements Adapter {
  constructor(private readonly db: Database) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const session = await this.db<SessionRow>('sessions').where({ id: sessionId }).first();
    if (!session) return [null, null];
    const user = await this.db<UserRow>('users').where({ id: session.user_id }).first();
    if (!user) return [null, null];
    return [toDatabaseSession(session), toDatabaseUser(user)];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.db<SessionRow>('sessions').where({ user_id: userId });
    return rows.map(toDatabaseSession);
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.db<SessionRow>('sessions').insert({
      id: session.id,
      user_id: session.userId,
      expires_at: session.expiresAt.getTime(),
    });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.db<SessionRow>('sessions')
      .where({ id: sessionId })
      .update({ expires_at: expiresAt.getTime() });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.db('sessions').where({ id: sessionId }).delete();
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.db('sessions').where({ user_id: userId }).delete();
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.db('sessions').where('expires_at', '<=', Date.now()).delete();
  }
}
