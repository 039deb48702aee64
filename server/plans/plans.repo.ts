/** Plans table: the only place that reads or writes saved plans. Rows become the shared API types. */
import type { Plan } from '../../shared/engine/documents';
import type { PlanRecord, PlanSummary } from '../../shared/schemas/plans.schema';
import type { Database } from '../db/database';
import { newId } from '../users/users.repo';

interface PlanRow {
  id: string;
  owner_id: string;
  name: string;
  description: string;
  document: string;
  set_count: number;
  created_at: string;
  updated_at: string;
}

const SUMMARY_COLUMNS = ['id', 'name', 'description', 'set_count', 'created_at', 'updated_at'] as const;

const toSummary = (row: Omit<PlanRow, 'owner_id' | 'document'>): PlanSummary => ({
  id: row.id,
  name: row.name,
  description: row.description,
  setCount: row.set_count,
  createdAt: row.created_at,
  updatedAt: row.updated_at,
});

const toRecord = (row: PlanRow): PlanRecord => ({
  ...toSummary(row),
  document: JSON.parse(row.document) as Plan,
});

/** Name, description and set count always come from the document itself. */
const derived = (document: Plan) => ({
  name: document.name,
  description: document.description,
  set_count: document.sets.length,
  document: JSON.stringify(document),
});

/** ISO timestamps that strictly increase per plan, so two saves in one millisecond still differ. */
function nextTimestamp(previous?: string): string {
  const now = Date.now();
  const after = previous ? Date.parse(previous) + 1 : now;
  return new Date(Math.max(now, after)).toISOString();
}

export type UpdateOutcome =
  { status: 'updated'; plan: PlanRecord } | { status: 'missing' } | { status: 'stale' };

export function plansRepo(db: Database) {
  return {
    async listForOwner(ownerId: string): Promise<PlanSummary[]> {
      const rows = await db<PlanRow>('plans')
        .select(...SUMMARY_COLUMNS)
        .where({ owner_id: ownerId })
        .orderBy([
          { column: 'updated_at', order: 'desc' },
          { column: 'id', order: 'asc' },
        ]);
      return rows.map(toSummary);
    },

    async findForOwner(id: string, ownerId: string): Promise<PlanRecord | null> {
      const row = await db<PlanRow>('plans').where({ id, owner_id: ownerId }).first();
      return row ? toRecord(row) : null;
    },

    async create(ownerId: string, document: Plan): Promise<PlanRecord> {
      const now = nextTimestamp();
      const row: PlanRow = {
        id: newId(),
        owner_id: ownerId,
        ...derived(document),
        created_at: now,
        updated_at: now,
      };
      await db('plans').insert(row);
      return toRecord(row);
    },

    /** Replaces the document; with `baseUpdatedAt`, only if nobody saved since then. */
    async update(
      id: string,
      ownerId: string,
      document: Plan,
      baseUpdatedAt?: string,
    ): Promise<UpdateOutcome> {
      return db.transaction(async (trx) => {
        const row = await trx<PlanRow>('plans').where({ id, owner_id: ownerId }).first();
        if (!row) return { status: 'missing' } as const;
        if (baseUpdatedAt !== undefined && baseUpdatedAt !== row.updated_at)
          return { status: 'stale' } as const;
        const next: PlanRow = { ...row, ...derived(document), updated_at: nextTimestamp(row.updated_at) };
        await trx('plans').where({ id }).update(next);
        return { status: 'updated', plan: toRecord(next) } as const;
      });
    },

    async delete(id: string, ownerId: string): Promise<boolean> {
      return (await db('plans').where({ id, owner_id: ownerId }).delete()) > 0;
    },
  };
}

export type PlansRepo = ReturnType<typeof plansRepo>;
