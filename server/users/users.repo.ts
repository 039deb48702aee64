/** Users table: the only place that reads or writes accounts. */
import { generateIdFromEntropySize } from 'lucia';
import type { Account } from '../../shared/schemas/account.schema';
import type { AdminUser, Role, User, UserListQuery } from '../../shared/schemas/auth.schema';
import type { Database } from '../db/database';

export interface UserRow {
  id: string;
  email: string;
  display_name: string;
  role: Role;
  password_hash: string;
  created_at: string;
  email_verified_at: string | null;
  disabled_at: string | null;
  last_sign_in_at: string | null;
  must_change_password: number | boolean;
  totp_secret: string | null;
  totp_enabled_at: string | null;
}

export const toUser = (row: UserRow): User => ({
  id: row.id,
  email: row.email,
  displayName: row.display_name,
  role: row.role,
  createdAt: row.created_at,
});

export const toAdminUser = (row: UserRow): AdminUser => ({
  ...toUser(row),
  emailVerified: row.email_verified_at !== null,
  disabled: row.disabled_at !== null,
  totpEnabled: row.totp_enabled_at !== null,
  lastSignInAt: row.last_sign_in_at,
});

export const toAccount = (row: UserRow): Account => ({
  ...toUser(row),
  emailVerified: row.email_verified_at !== null,
  totpEnabled: row.totp_enabled_at !== null,
  mustChangePassword: Boolean(row.must_change_password),
  lastSignInAt: row.last_sign_in_at,
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
      /** Unverified accounts cannot sign in until the mailed link is followed. Default: verified. */
      verified?: boolean;
      mustChangePassword?: boolean;
    }): Promise<User | null> {
      const now = new Date().toISOString();
      const row: UserRow = {
        id: newId(),
        email: input.email,
        display_name: input.displayName,
        role: input.role,
        password_hash: input.passwordHash,
        created_at: now,
        email_verified_at: input.verified === false ? null : now,
        disabled_at: null,
        last_sign_in_at: null,
        must_change_password: input.mustChangePassword ?? false,
        totp_secret: null,
        totp_enabled_at: null,
      };
      await db('users').insert(row).onConflict('email').ignore();
      // When the e-mail was taken the insert was skipped and no row carries the new id.
      const created = await db<UserRow>('users').where({ id: row.id }).first();
      return created ? toUser(created) : null;
    },

    async setPasswordHash(id: string, passwordHash: string, mustChange = false): Promise<void> {
      await db('users')
        .where({ id })
        .update({ password_hash: passwordHash, must_change_password: mustChange });
    },

    async markVerified(id: string): Promise<void> {
      await db('users').where({ id }).whereNull('email_verified_at').update({
        email_verified_at: new Date().toISOString(),
      });
    },

    async recordSignIn(id: string): Promise<void> {
      await db('users').where({ id }).update({ last_sign_in_at: new Date().toISOString() });
    },

    async setDisabled(id: string, disabled: boolean): Promise<AdminUser | null> {
      const changed = await db('users')
        .where({ id })
        .update({ disabled_at: disabled ? new Date().toISOString() : null });
      if (!changed) return null;
      const row = await db<UserRow>('users').where({ id }).first();
      return row ? toAdminUser(row) : null;
    },

    async setDisplayName(id: string, displayName: string): Promise<void> {
      await db('users').where({ id }).update({ display_name: displayName });
    },

    /** Returns false when another account has the address. */
    async setEmail(id: string, email: string): Promise<boolean> {
      const taken = await db<UserRow>('users').where({ email }).whereNot({ id }).first();
      if (taken) return false;
      await db('users').where({ id }).update({ email, email_verified_at: new Date().toISOString() });
      return true;
    },

    async setTotpSecret(id: string, secret: string | null, enabled: boolean): Promise<void> {
      await db('users')
        .where({ id })
        .update({ totp_secret: secret, totp_enabled_at: enabled ? new Date().toISOString() : null });
    },

    async delete(id: string): Promise<boolean> {
      return (await db('users').where({ id }).delete()) > 0;
    },

    async countAdmins(): Promise<number> {
      const row = await db('users')
        .where({ role: 'admin' })
        .whereNull('disabled_at')
        .count<{ n: number }[]>({ n: '*' })
        .first();
      return Number(row?.n ?? 0);
    },

    async setRole(id: string, role: Role): Promise<AdminUser | null> {
      const changed = await db('users').where({ id }).update({ role });
      if (!changed) return null;
      const row = await db<UserRow>('users').where({ id }).first();
      return row ? toAdminUser(row) : null;
    },

    async list(query: UserListQuery): Promise<{ items: AdminUser[]; total: number }> {
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
      return { items: rows.map(toAdminUser), total: Number(countRow?.n ?? 0) };
    },
  };
}

export type UsersRepo = ReturnType<typeof usersRepo>;
