/** Single-use tokens sent in mail links (verify, reset, change of address), stored as SHA-256 only. */
import type { Database } from '../db/database';

export type TokenPurpose = 'verify-email' | 'reset-password' | 'change-email';

interface TokenRow {
  id: string;
  user_id: string;
  purpose: TokenPurpose;
  email: string | null;
  expires_at: number;
}

export function tokensRepo(db: Database) {
  return {
    /** Replaces any earlier token of the same purpose, so only the newest link works. */
    async issue(row: TokenRow): Promise<void> {
      await db.transaction(async (trx) => {
        await trx('account_tokens').where({ user_id: row.user_id, purpose: row.purpose }).delete();
        await trx('account_tokens').insert(row);
      });
    },

    /** Takes the token out (single use) and returns it if it was live and of that purpose. */
    async consume(id: string, purpose: TokenPurpose, now: number): Promise<TokenRow | null> {
      return db.transaction(async (trx) => {
        const row = await trx<TokenRow>('account_tokens').where({ id, purpose }).first();
        if (!row) return null;
        await trx('account_tokens').where({ id }).delete();
        return Number(row.expires_at) > now ? row : null;
      });
    },
  };
}

export type TokensRepo = ReturnType<typeof tokensRepo>;
