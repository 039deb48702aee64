/** Failed sign-in counters, in SQLite so a restart does not hand an attacker a fresh budget. */
import type { Database } from '../db/database';

interface FailureRow {
  key: string;
  failures: number;
  window_started_at: number;
}

export function signInThrottleRepo(db: Database) {
  return {
    async find(keys: string[]): Promise<FailureRow[]> {
      return db<FailureRow>('sign_in_failures').whereIn('key', keys);
    },

    /** Adds one failure to each key, starting a new window where the old one has ended. */
    async add(keys: string[], now: number, windowMs: number): Promise<void> {
      await db.transaction(async (trx) => {
        for (const key of keys) {
          const row = await trx<FailureRow>('sign_in_failures').where({ key }).first();
          if (!row || row.window_started_at + windowMs <= now) {
            await trx('sign_in_failures')
              .insert({ key, failures: 1, window_started_at: now })
              .onConflict('key')
              .merge();
          } else {
            await trx('sign_in_failures').where({ key }).increment('failures', 1);
          }
        }
      });
    },

    async clear(key: string): Promise<void> {
      await db('sign_in_failures').where({ key }).delete();
    },
  };
}
