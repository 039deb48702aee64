/** Users table: the only place that reads or writes accounts. */
import { generateIdFromEntropySize } from 'lucia';
import type { Role, User, UserListQuery } from '../../shared/schemas/auth.schema';
import type { Database } from '../db/database';

export interface UserRow {
  id: string;
  email: string;
  display_name: string;
  role: Role;
  password_hash: string;
  created_at: string;
}

export const toUser = (row: UserRow): User => ({
  id: row.id,
  email: row.email,
  displayName: row.display_name,
  role: row.role,
  createdAt: row.created_at,
});

export const newId = (): string => generateIdFromEntropySize(10);

const SORT_COLUMNS: Record<UserListQuery['sort'], string> = {
  email: 'email',
  displayName: 'display_name',
  role: 'role',
  createdAt: 'created_at',
};

export function usersRepo(db: Database) {
  return {
    async findByEmail(email: string): Promise<UserRow | undefined> {
      return db<UserRow>('users').where({ email }).first();
    },

    async findById(id: string): Promise<UserRow | undefined> {
      return db<UserRow>('users').where({ id }).first();
    },

    /** Returns null when the e-mail is already taken. */
    async create(input: {
      email: string;
      displayName: string;
      role: Role;
      passwordHash: string;
    }): Promise<User | null> {
      const row: UserRow = {
        id: newId(),
        email: input.email,
        display_name: input.displayName,
        role: input.role,
        password_hash: input.passwordHash,
        created_at: new Date().toISOString(),
      };
      await db('users').insert(row).onConflict('email').ignore();
      // When the e-mail was taken the insert was skipped and no row carries the new id.
      const created = await db<UserRow>('users').where({ id: row.id }).first();
      return created ? toUser(created) : null;
    },

    async setPasswordHash(id: string, passwordHash: string): Promise<void> {
      await db('users').where({ id }).update({ password_hash: passwordHash });
    },

    async setRole(id: string, role: Role): Promise<User | null> {
      const changed = await db('users').where({ id }).update({ role });
      if (!changed) return null;
      const row = await db<UserRow>('users').where({ id }).first();
      return row ? toUser(row) : null;
    },

    async list(query: UserListQuery): Promise<{ items: User[]; total: number }> {
      const filtered = db<UserRow>('users').modify((qb) => {
        if (query.role) qb.where('role', query.role);
        if (query.search) {
          const like = `%${query.search.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
          qb.where((w) =>
            w
              .whereRaw("lower(email) like ? escape '\\'", [like])
              .orWhereRaw("lower(display_name) like ? escape '\\'", [like]),
          );
        }
      });
      const countRow = await filtered.clone().count<{ n: number }[]>({ n: '*' }).first();
      const rows = await filtered
        .clone()
        .select('*')
        .orderBy([
          { column: SORT_COLUMNS[query.sort], order: query.order },
          { column: 'id', order: 'asc' },
        ])
        .limit(query.pageSize)
        .offset((query.page - 1) * query.pageSize);
      return { items: rows.map(toUser), total: Number(countRow?.n ?? 0) };
    },
  };
}

export type UsersRepo = ReturnType<typeof usersRepo>;
