/**
 * Plans and their revisions: the only place that reads or writes saved plans. Rows become the shared API types.
 * Who may see a plan is answered here in SQL (owner, or an active share to the asking address) so lists and
 * single reads agree.
 */
import type { Knex } from 'knex';
import type { Plan } from '../../shared/engine/documents';
import type { PlanAccess, PlanListQuery, PlanRecord, PlanSummary } from '../../shared/schemas/plans.schema';
import type {
  PlanRevision,
  PlanRevisionSummary,
  RevisionReason,
} from '../../shared/schemas/plan-revisions.schema';
import type { Database } from '../db/database';
import { preparedRead } from '../db/prepared';
import { newId } from '../users/users.repo';
import { openFaultCount } from './plan-facts';

interface PlanRow {
  id: string;
  owner_id: string;
  name: string;
  description: string;
  document: string;
  set_count: number;
  fault_count: number;
  byte_size: number;
  created_at: string;
  updated_at: string;
  deleted_at: string | null;
}

interface ListedRow extends Omit<PlanRow, 'document'> {
  owner_name: string;
  shared: number;
}

interface RevisionRow {
  id: number;
  plan_id: string;
  number: number;
  document: string;
  author_id: string | null;
  reason: RevisionReason;
  restored_from: number | null;
  created_at: string;
}

/** The viewer asking: their id and their (lower-cased) address, which shares are made out to. */
export interface Viewer {
  id: string;
  email: string;
}

const SORT_COLUMNS: Record<PlanListQuery['sort'], string> = {
  name: 'plans.name',
  setCount: 'plans.set_count',
  faultCount: 'plans.fault_count',
  updatedAt: 'plans.updated_at',
  shared: 'shared',
};

const SUMMARY_COLUMNS = [
  'plans.id',
  'plans.owner_id',
  'plans.name',
  'plans.description',
  'plans.set_count',
  'plans.fault_count',
  'plans.byte_size',
  'plans.created_at',
  'plans.updated_at',
  'plans.deleted_at',
];

const accessOf = (row: { owner_id: string }, viewer: Viewer): PlanAccess =>
  row.owner_id === viewer.id ? 'owner' : 'viewer';

const toSummary = (row: ListedRow, viewer: Viewer): PlanSummary => ({
  id: row.id,
  name: row.name,
  description: row.description,
  setCount: row.set_count,
  faultCount: row.fault_count,
  shared: Boolean(row.shared),
  access: accessOf(row, viewer),
  ownerName: row.owner_name,
  createdAt: row.created_at,
  updatedAt: row.updated_at,
  deletedAt: row.deleted_at,
});

/** Name, description, set count and size always come from the document itself. */
const derived = (document: Plan) => {
  const text = JSON.stringify(document);
  return {
    name: document.name,
    description: document.description,
    set_count: document.sets.length,
    fault_count: openFaultCount(document),
    byte_size: Buffer.byteLength(text),
    document: text,
  };
};

/** ISO timestamps that strictly increase per plan, so two saves in one millisecond still differ. */
function nextTimestamp(previous?: string): string {
  const now = Date.now();
  const after = previous ? Date.parse(previous) + 1 : now;
  return new Date(Math.max(now, after)).toISOString();
}

const likePattern = (q: string) => `%${q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export type UpdateOutcome =
  { status: 'updated'; plan: PlanRow; revision: number } | { status: 'missing' } | { status: 'stale' };

export function plansRepo(db: Database) {
  /** Shares that still work, made out to this address (a link visitor's row carries their address too). */
  const activeShareFor = (qb: Knex.QueryBuilder, email: string) =>
    qb
      .select(db.raw('1'))
      .from('plan_shares as s')
      .whereRaw('s.plan_id = plans.id')
      .where('s.kind', 'user')
      .where('s.email', email)
      .whereNull('s.revoked_at');

  const sharedFlag = db.raw(
    "exists(select 1 from plan_shares o where o.plan_id = plans.id and o.revoked_at is null and (o.kind = 'link' or o.via_share_id is null)) as shared",
  );

  /** Plans this viewer may see, with the owner's name and the shared flag. */
  const visible = (viewer: Viewer) =>
    db('plans')
      .join('users', 'users.id', 'plans.owner_id')
      .select(...SUMMARY_COLUMNS, 'users.display_name as owner_name', sharedFlag)
      .whereNull('plans.deleted_at')
      .where((w) =>
        w.where('plans.owner_id', viewer.id).orWhereExists((qb) => activeShareFor(qb, viewer.email)),
      );

  async function latestRevision(trx: Knex, planId: string): Promise<number> {
    const row = await trx('plan_revisions')
      .where({ plan_id: planId })
      .max<{ n: number | null }>({ n: 'number' })
      .first();
    return Number(row?.n ?? 0);
  }

  async function addRevision(
    trx: Knex,
    planId: string,
    document: string,
    authorId: string,
    reason: RevisionReason,
    at: string,
    restoredFrom: number | null = null,
  ): Promise<number> {
    const number = (await latestRevision(trx, planId)) + 1;
    await trx('plan_revisions').insert({
      plan_id: planId,
      number,
      document,
      author_id: authorId,
      reason,
      restored_from: restoredFrom,
      created_at: at,
    });
    return number;
  }

  async function record(row: PlanRow, viewer: Viewer, trx: Knex = db): Promise<PlanRecord> {
    const listed = (await trx('plans')
      .join('users', 'users.id', 'plans.owner_id')
      .select(...SUMMARY_COLUMNS, 'users.display_name as owner_name', sharedFlag)
      .where('plans.id', row.id)
      .first()) as ListedRow;
    return {
      ...toSummary(listed, viewer),
      document: JSON.parse(row.document) as Plan,
      revision: await latestRevision(trx, row.id),
    };
  }

  /**
   * The same rule as `visible` and the same answer as `record`, in one statement prepared once, for the read
   * every opened plan makes.
   */
  const visibleRecord = preparedRead<ListedRow & { document: string; revision: number | null }>(
    db,
    `select ${SUMMARY_COLUMNS.join(', ')}, plans.document, users.display_name as owner_name, ${sharedFlag.toQuery()},
       (select max(r.number) from plan_revisions r where r.plan_id = plans.id) as revision
     from plans join users on users.id = plans.owner_id
     where plans.id = ? and plans.deleted_at is null and (plans.owner_id = ? or exists (
       select 1 from plan_shares s where s.plan_id = plans.id and s.kind = 'user' and s.email = ? and s.revoked_at is null))`,
  );

  return {
    record,

    /**
     * A plan this viewer may see as the JSON text of its `PlanRecord`, or null. The stored document was
     * checked and serialised when it was written, so it goes out as stored instead of parsed and re-serialised.
     */
    async visibleRecordJson(id: string, viewer: Viewer): Promise<string | null> {
      const row = await visibleRecord.get(id, viewer.id, viewer.email);
      if (!row) return null;
      const { document, revision, ...listed } = row;
      const summary = JSON.stringify(toSummary(listed, viewer)).slice(0, -1);
      return `${summary},"document":${document},"revision":${Number(revision ?? 0)}}`;
    },

    /** Every plan the viewer owns (deleted ones left out), whole: for the download of one's own data. */
    async ownRecords(viewer: Viewer): Promise<PlanRecord[]> {
      const rows = await db<PlanRow>('plans')
        .where({ owner_id: viewer.id })
        .whereNull('deleted_at')
        .orderBy([
          { column: 'updated_at', order: 'desc' },
          { column: 'id', order: 'asc' },
        ]);
      return Promise.all(rows.map((row) => record(row, viewer)));
    },

    async list(viewer: Viewer, query: PlanListQuery): Promise<{ items: PlanSummary[]; total: number }> {
      const base = db('plans')
        .join('users', 'users.id', 'plans.owner_id')
        .modify((qb) => {
          if (query.scope === 'mine') qb.where('plans.owner_id', viewer.id).whereNull('plans.deleted_at');
          if (query.scope === 'deleted')
            qb.where('plans.owner_id', viewer.id).whereNotNull('plans.deleted_at');
          if (query.scope === 'shared')
            qb.whereNot('plans.owner_id', viewer.id)
              .whereNull('plans.deleted_at')
              .whereExists((s) => activeShareFor(s, viewer.email));
          if (query.q) {
            const like = likePattern(query.q);
            qb.where((w) =>
              w
                .whereRaw("lower(plans.name) like ? escape '\\'", [like])
                .orWhereRaw("lower(plans.description) like ? escape '\\'", [like]),
            );
          }
        });
      const countRow = await base.clone().count<{ n: number }[]>({ n: '*' }).first();
      const rows = (await base
        .clone()
        .select(...SUMMARY_COLUMNS, 'users.display_name as owner_name', sharedFlag)
        .orderBy([
          { column: SORT_COLUMNS[query.sort], order: query.order },
          { column: 'plans.updated_at', order: 'desc' },
          { column: 'plans.id', order: 'asc' },
        ])
        .limit(query.pageSize)
        .offset((query.page - 1) * query.pageSize)) as ListedRow[];
      return { items: rows.map((r) => toSummary(r, viewer)), total: Number(countRow?.n ?? 0) };
    },

    /** The plan if this viewer may see it (owner or an active share), with their access; else null. */
    async findVisible(id: string, viewer: Viewer): Promise<{ row: PlanRow; access: PlanAccess } | null> {
      const listed = await visible(viewer).where('plans.id', id).first();
      if (!listed) return null;
      const row = await db<PlanRow>('plans').where({ id }).first();
      return row ? { row, access: accessOf(row, viewer) } : null;
    },

    /** One of the owner's deleted plans (for undoing the delete). */
    async findDeleted(id: string, ownerId: string): Promise<PlanRow | null> {
      return (
        (await db<PlanRow>('plans').where({ id, owner_id: ownerId }).whereNotNull('deleted_at').first()) ??
        null
      );
    },

    async create(ownerId: string, document: Plan, reason: RevisionReason = 'create'): Promise<PlanRow> {
      const now = nextTimestamp();
      const row: PlanRow = {
        id: newId(),
        owner_id: ownerId,
        ...derived(document),
        created_at: now,
        updated_at: now,
        deleted_at: null,
      };
      await db.transaction(async (trx) => {
        await trx('plans').insert(row);
        await addRevision(trx, row.id, row.document, ownerId, reason, now);
      });
      return row;
    },

    /**
     * Replaces the document when nobody saved since `baseUpdatedAt`. A document equal to the stored one is
     * not a change: no new revision, and the timestamp stays.
     */
    async update(
      id: string,
      ownerId: string,
      document: Plan,
      baseUpdatedAt: string,
      change: { reason: RevisionReason; restoredFrom?: number } = { reason: 'save' },
    ): Promise<UpdateOutcome> {
      return db.transaction(async (trx) => {
        const row = await trx<PlanRow>('plans')
          .where({ id, owner_id: ownerId })
          .whereNull('deleted_at')
          .first();
        if (!row) return { status: 'missing' } as const;
        if (baseUpdatedAt !== row.updated_at) return { status: 'stale' } as const;
        if (JSON.stringify(document) === row.document)
          return { status: 'updated', plan: row, revision: await latestRevision(trx, id) } as const;
        const values = derived(document);
        const next: PlanRow = { ...row, ...values, updated_at: nextTimestamp(row.updated_at) };
        await trx('plans').where({ id }).update(next);
        const revision = await addRevision(
          trx,
          id,
          next.document,
          ownerId,
          change.reason,
          next.updated_at,
          change.restoredFrom ?? null,
        );
        return { status: 'updated', plan: next, revision } as const;
      });
    },

    async softDelete(id: string, ownerId: string): Promise<boolean> {
      const changed = await db('plans')
        .where({ id, owner_id: ownerId })
        .whereNull('deleted_at')
        .update({ deleted_at: new Date().toISOString() });
      return changed > 0;
    },

    async undelete(id: string, ownerId: string): Promise<boolean> {
      const changed = await db('plans')
        .where({ id, owner_id: ownerId })
        .whereNotNull('deleted_at')
        .update({ deleted_at: null });
      return changed > 0;
    },

    /** Ids of plans deleted before `cutoff` (ISO time), for removing their files before `purge`. */
    async deletedBefore(cutoff: string): Promise<string[]> {
      const rows = await db('plans').where('deleted_at', '<', cutoff).select('id');
      return rows.map((r: { id: string }) => r.id);
    },

    /** Removes plans for good; revisions, shares and photo rows go with them (foreign keys cascade). */
    async purge(ids: string[]): Promise<void> {
      if (ids.length) await db('plans').whereIn('id', ids).delete();
    },

    /** The owner's live plans and the bytes their documents take. */
    async usage(ownerId: string): Promise<{ plans: number; bytes: number }> {
      const row = await db('plans')
        .where({ owner_id: ownerId })
        .whereNull('deleted_at')
        .select(db.raw('count(*) as n'), db.raw('coalesce(sum(byte_size), 0) as bytes'))
        .first();
      return { plans: Number(row?.n ?? 0), bytes: Number(row?.bytes ?? 0) };
    },

    async listRevisions(planId: string): Promise<PlanRevisionSummary[]> {
      const rows = await db('plan_revisions as r')
        .leftJoin('users as u', 'u.id', 'r.author_id')
        .where('r.plan_id', planId)
        .select('r.*', 'u.display_name as author_name')
        .orderBy('r.number', 'desc');
      return rows.map((r: RevisionRow & { author_name: string | null }) => toRevisionSummary(r));
    },

    async getRevision(planId: string, number: number): Promise<PlanRevision | null> {
      const row = (await db('plan_revisions as r')
        .leftJoin('users as u', 'u.id', 'r.author_id')
        .where({ 'r.plan_id': planId, 'r.number': number })
        .select('r.*', 'u.display_name as author_name')
        .first()) as (RevisionRow & { author_name: string | null }) | undefined;
      return row ? { ...toRevisionSummary(row), document: JSON.parse(row.document) as Plan } : null;
    },
  };
}

function toRevisionSummary(row: RevisionRow & { author_name: string | null }): PlanRevisionSummary {
  const document = JSON.parse(row.document) as Plan;
  return {
    number: row.number,
    createdAt: row.created_at,
    authorName: row.author_name ?? '',
    reason: row.reason,
    restoredFrom: row.restored_from,
    name: document.name,
    setCount: document.sets.length,
  };
}

export type PlansRepo = ReturnType<typeof plansRepo>;
export type { PlanRow };
