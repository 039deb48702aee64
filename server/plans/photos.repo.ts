/** Photo records: the only place that reads or writes plan_photos. The pictures themselves are in the photo store. */
import type { PlanPhoto } from '../../shared/schemas/plan-photos.schema';
import type { Database } from '../db/database';
import { newId } from '../users/users.repo';

export interface PhotoRow {
  id: string;
  plan_id: string;
  part_id: string;
  caption: string;
  file_name: string;
  thumb_name: string;
  mime: string;
  width: number;
  height: number;
  byte_size: number;
  uploaded_by: string | null;
  created_at: string;
}

const base = (row: PhotoRow) => `/api/plans/${row.plan_id}/photos/${row.id}`;

export const toPhoto = (row: PhotoRow): PlanPhoto => ({
  id: row.id,
  partId: row.part_id,
  caption: row.caption,
  width: row.width,
  height: row.height,
  createdAt: row.created_at,
  url: `${base(row)}/image`,
  thumbUrl: `${base(row)}/thumb`,
});

export function photosRepo(db: Database) {
  return {
    async list(planId: string, partId?: string): Promise<PhotoRow[]> {
      return db<PhotoRow>('plan_photos')
        .where({ plan_id: planId })
        .modify((qb) => {
          if (partId) qb.where({ part_id: partId });
        })
        .orderBy([
          { column: 'created_at', order: 'asc' },
          { column: 'id', order: 'asc' },
        ]);
    },

    async find(planId: string, photoId: string): Promise<PhotoRow | null> {
      return (await db<PhotoRow>('plan_photos').where({ plan_id: planId, id: photoId }).first()) ?? null;
    },

    async insert(input: Omit<PhotoRow, 'id' | 'created_at'>): Promise<PhotoRow> {
      const row: PhotoRow = { ...input, id: newId(), created_at: new Date().toISOString() };
      await db('plan_photos').insert(row);
      return row;
    },

    async setCaption(planId: string, photoId: string, caption: string): Promise<PhotoRow | null> {
      const changed = await db('plan_photos').where({ plan_id: planId, id: photoId }).update({ caption });
      return changed ? this.find(planId, photoId) : null;
    },

    async remove(planId: string, photoId: string): Promise<void> {
      await db('plan_photos').where({ plan_id: planId, id: photoId }).delete();
    },

    /** Bytes of the photos on an owner's live plans, for the storage quota. */
    async bytesForOwner(ownerId: string): Promise<number> {
      const row = await db('plan_photos as p')
        .join('plans', 'plans.id', 'p.plan_id')
        .where('plans.owner_id', ownerId)
        .whereNull('plans.deleted_at')
        .sum<{ n: number | null }>({ n: 'p.byte_size' })
        .first();
      return Number(row?.n ?? 0);
    },

    /** File names of every photo on these plans, so their files can go when the plans are purged. */
    async filesOf(planIds: string[]): Promise<string[]> {
      if (!planIds.length) return [];
      const rows = await db<PhotoRow>('plan_photos')
        .whereIn('plan_id', planIds)
        .select('file_name', 'thumb_name');
      return rows.flatMap((r) => [r.file_name, r.thumb_name]);
    },
  };
}

export type PhotosRepo = ReturnType<typeof photosRepo>;
