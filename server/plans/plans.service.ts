/**
 * The rules of the plans library, between the routes and the repositories: who may see or change a plan,
 * the account's quotas and the set bound, revisions on every change, and purging deleted plans after 30 days.
 */
import type { Logger } from 'pino';
import type { Plan } from '../../shared/engine/index';
import type { User } from '../../shared/schemas/auth.schema';
import type { RevisionReason } from '../../shared/schemas/plan-revisions.schema';
import type { PlanAccess, PlanRecord, PlanUsage } from '../../shared/schemas/plans.schema';
import { HttpError, notFound } from '../http/http-error';
import type { PhotoStore } from './photo-store';
import type { PhotosRepo } from './photos.repo';
import type { PlanRow, PlansRepo, Viewer } from './plans.repo';

/** Deleted plans stay recoverable this long. */
export const PURGE_AFTER_DAYS = 30;

const CONFLICT_MESSAGE = 'This plan was saved elsewhere since you opened it. Reload it first.';

export interface PlansServiceDeps {
  plans: PlansRepo;
  photos: PhotosRepo;
  store: PhotoStore;
  limits: PlanLimits;
  logger: Logger;
}

/** The per-account quota and the plan size bound, from the server's settings. */
export interface PlanLimits {
  maxPlans: number;
  maxBytes: number;
  maxSets: number;
  importMaxBytes: number;
}

export const viewerOf = (user: User): Viewer => ({ id: user.id, email: user.email.toLowerCase() });

export function plansService({ plans, photos, store, limits, logger }: PlansServiceDeps) {
  async function usage(ownerId: string): Promise<PlanUsage> {
    const [own, photoBytes] = await Promise.all([plans.usage(ownerId), photos.bytesForOwner(ownerId)]);
    return {
      plans: own.plans,
      maxPlans: limits.maxPlans,
      bytes: own.bytes + photoBytes,
      maxBytes: limits.maxBytes,
      maxSets: limits.maxSets,
    };
  }

  /** Refuses a write that would take the account past its quotas. */
  async function checkRoom(ownerId: string, more: { plans: number; bytes: number }): Promise<void> {
    const now = await usage(ownerId);
    if (now.plans + more.plans > now.maxPlans)
      throw new HttpError(
        409,
        'CONFLICT',
        `Your account holds at most ${now.maxPlans} plans. Delete one you no longer need first.`,
      );
    if (now.bytes + more.bytes > now.maxBytes)
      throw new HttpError(
        409,
        'CONFLICT',
        `Your plans and photos would take more than the ${Math.round(now.maxBytes / 1024 / 1024)} MB your account may keep. Delete photos or plans first.`,
      );
  }

  const sizeOf = (document: Plan) => Buffer.byteLength(JSON.stringify(document));

  /** A plan the user may see, with their access; anything else is 404 as if it did not exist. */
  async function visible(id: string, user: User): Promise<{ row: PlanRow; access: PlanAccess }> {
    const found = await plans.findVisible(id, viewerOf(user));
    if (!found) throw notFound('That plan');
    return found;
  }

  /** A plan the user owns; a viewer is told they may only look. */
  async function owned(id: string, user: User): Promise<PlanRow> {
    const found = await visible(id, user);
    if (found.access !== 'owner')
      throw new HttpError(
        403,
        'FORBIDDEN',
        'This plan is shared with you to view. Make a copy to change it.',
      );
    return found.row;
  }

  return {
    usage,
    visible,
    owned,

    async create(user: User, document: Plan, reason: RevisionReason = 'create'): Promise<PlanRecord> {
      await checkRoom(user.id, { plans: 1, bytes: sizeOf(document) });
      const row = await plans.create(user.id, document, reason);
      return plans.record(row, viewerOf(user));
    },

    async get(id: string, user: User): Promise<PlanRecord> {
      const { row } = await visible(id, user);
      return plans.record(row, viewerOf(user));
    },

    async save(
      id: string,
      user: User,
      document: Plan,
      baseUpdatedAt: string,
      change?: { reason: RevisionReason; restoredFrom?: number },
    ): Promise<PlanRecord> {
      const row = await owned(id, user);
      const grows = sizeOf(document) - row.byte_size;
      if (grows > 0) await checkRoom(user.id, { plans: 0, bytes: grows });
      const outcome = await plans.update(id, user.id, document, baseUpdatedAt, change);
      if (outcome.status === 'missing') throw notFound('That plan');
      if (outcome.status === 'stale') throw new HttpError(409, 'CONFLICT', CONFLICT_MESSAGE);
      return plans.record(outcome.plan, viewerOf(user));
    },

    async remove(id: string, user: User): Promise<void> {
      await owned(id, user);
      await plans.softDelete(id, user.id);
    },

    async undelete(id: string, user: User): Promise<PlanRecord> {
      const row = await plans.findDeleted(id, user.id);
      if (!row) throw notFound('That deleted plan');
      await checkRoom(user.id, { plans: 1, bytes: row.byte_size });
      await plans.undelete(id, user.id);
      return plans.record({ ...row, deleted_at: null }, viewerOf(user));
    },

    /** Removes plans deleted more than 30 days ago, with their photo files. Failures are logged, never thrown. */
    async purgeExpired(now = Date.now()): Promise<number> {
      try {
        const cutoff = new Date(now - PURGE_AFTER_DAYS * 24 * 60 * 60_000).toISOString();
        const ids = await plans.deletedBefore(cutoff);
        if (!ids.length) return 0;
        const files = await photos.filesOf(ids);
        await plans.purge(ids);
        await store.remove(files);
        return ids.length;
      } catch (err) {
        logger.error({ err }, 'deleted plans not purged');
        return 0;
      }
    },
  };
}

export type PlansService = ReturnType<typeof plansService>;
