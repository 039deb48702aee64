/** The work record: the only place that reads or writes plan_work_records and plan_work_entries. */
import type { AsFoundPart, WorkEntry } from '../../shared/schemas/work-record.schema';
import type { Database } from '../db/database';

interface EntryRow {
  plan_id: string;
  entry_key: string;
  done_at: string | null;
  initials: string;
  note: string;
  updated_by: string | null;
  updated_at: string;
}

const toEntry = (row: EntryRow): WorkEntry => ({
  key: row.entry_key,
  done: row.done_at !== null,
  doneAt: row.done_at,
  initials: row.initials,
  note: row.note,
  updatedAt: row.updated_at,
});

export function workRecordRepo(db: Database) {
  return {
    async asFound(planId: string): Promise<{ parts: AsFoundPart[]; recordedAt: string } | null> {
      const row = await db('plan_work_records')
        .where({ plan_id: planId })
        .first<{ as_found: string; recorded_at: string } | undefined>();
      return row ? { parts: JSON.parse(row.as_found) as AsFoundPart[], recordedAt: row.recorded_at } : null;
    },

    /** Keeps the as-found record once; a later call leaves the first one as it is. */
    async keepAsFound(planId: string, parts: AsFoundPart[], userId: string): Promise<void> {
      await db('plan_work_records')
        .insert({
          plan_id: planId,
          as_found: JSON.stringify(parts),
          recorded_by: userId,
          recorded_at: new Date().toISOString(),
        })
        .onConflict('plan_id')
        .ignore();
    },

    async entries(planId: string): Promise<WorkEntry[]> {
      const rows = await db<EntryRow>('plan_work_entries').where({ plan_id: planId }).orderBy('entry_key');
      return rows.map(toEntry);
    },

    /** Ticking stamps the date once (a second tick keeps the first date); unticking clears it. */
    async saveEntry(
      planId: string,
      key: string,
      input: { done: boolean; initials: string; note: string },
      userId: string,
    ): Promise<WorkEntry> {
      const now = new Date().toISOString();
      return db.transaction(async (trx) => {
        const old = await trx<EntryRow>('plan_work_entries')
          .where({ plan_id: planId, entry_key: key })
          .first();
        const row: EntryRow = {
          plan_id: planId,
          entry_key: key,
          done_at: input.done ? (old?.done_at ?? now) : null,
          initials: input.initials,
          note: input.note,
          updated_by: userId,
          updated_at: now,
        };
        await trx('plan_work_entries').insert(row).onConflict(['plan_id', 'entry_key']).merge();
        return toEntry(row);
      });
    },
  };
}

export type WorkRecordRepo = ReturnType<typeof workRecordRepo>;
