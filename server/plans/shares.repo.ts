/** Read-only shares of plans: the only place that reads or writes plan_shares. */
import { createHash, randomBytes } from 'node:crypto';
import type { PlanShare } from '../../shared/schemas/plan-shares.schema';
import type { Database } from '../db/database';
import { newId } from '../users/users.repo';

interface ShareRow {
  id: string;
  plan_id: string;
  kind: 'user' | 'link';
  email: string | null;
  token_hash: string | null;
  via_share_id: string | null;
  created_at: string;
  revoked_at: string | null;
}

export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');

export function sharesRepo(db: Database) {
  return {
    /** Shares the owner made (not the rows of people who came in through a link), newest first. */
    async listForPlan(planId: string): Promise<PlanShare[]> {
      const rows = (await db('plan_shares as s')
        .where({ 's.plan_id': planId })
        .whereNull('s.revoked_at')
        .whereNull('s.via_share_id')
        .select(
          's.*',
          db.raw(
            '(select count(*) from plan_shares v where v.via_share_id = s.id and v.revoked_at is null) as visitors',
          ),
        )
        .orderBy('s.created_at', 'desc')) as (ShareRow & { visitors: number })[];
      return rows.map((r) => ({
        id: r.id,
        kind: r.kind,
        email: r.kind === 'user' ? r.email : null,
        createdAt: r.created_at,
        visitors: Number(r.visitors),
      }));
    },

    /** Shares with one address; sharing twice with the same person gives back the first share. */
    async shareWithEmail(planId: string, email: string): Promise<{ id: string; created: boolean }> {
      const existing = await db<ShareRow>('plan_shares')
        .where({ plan_id: planId, kind: 'user', email })
        .whereNull('via_share_id')
        .whereNull('revoked_at')
        .first();
      if (existing) return { id: existing.id, created: false };
      const row: ShareRow = {
        id: newId(),
        plan_id: planId,
        kind: 'user',
        email,
        token_hash: null,
        via_share_id: null,
        created_at: new Date().toISOString(),
        revoked_at: null,
      };
      await db('plan_shares').insert(row);
      return { id: row.id, created: true };
    },

    /** A new link; the secret is returned once and only its hash is kept. */
    async createLink(planId: string): Promise<{ id: string; token: string }> {
      const token = randomBytes(32).toString('base64url');
      const row: ShareRow = {
        id: newId(),
        plan_id: planId,
        kind: 'link',
        email: null,
        token_hash: hashToken(token),
        via_share_id: null,
        created_at: new Date().toISOString(),
        revoked_at: null,
      };
      await db('plan_shares').insert(row);
      return { id: row.id, token };
    },

    async findLink(token: string): Promise<{ id: string; planId: string } | null> {
      const row = await db<ShareRow>('plan_shares')
        .where({ kind: 'link', token_hash: hashToken(token) })
        .whereNull('revoked_at')
        .first();
      return row ? { id: row.id, planId: row.plan_id } : null;
    },

    /** Someone opened a link: from now on they see the plan under "shared with me" until the link is revoked. */
    async addVisitor(linkId: string, planId: string, email: string): Promise<void> {
      const existing = await db('plan_shares')
        .where({ via_share_id: linkId, email })
        .whereNull('revoked_at')
        .first();
      if (existing) return;
      await db('plan_shares').insert({
        id: newId(),
        plan_id: planId,
        kind: 'user',
        email,
        token_hash: null,
        via_share_id: linkId,
        created_at: new Date().toISOString(),
        revoked_at: null,
      } satisfies ShareRow);
    },

    /** Ends a share, and every visit made through it when it is a link. */
    async revoke(planId: string, shareId: string): Promise<boolean> {
      return db.transaction(async (trx) => {
        const now = new Date().toISOString();
        const changed = await trx('plan_shares')
          .where({ id: shareId, plan_id: planId })
          .whereNull('via_share_id')
          .whereNull('revoked_at')
          .update({ revoked_at: now });
        if (changed)
          await trx('plan_shares')
            .where({ via_share_id: shareId })
            .whereNull('revoked_at')
            .update({ revoked_at: now });
        return changed > 0;
      });
    },
  };
}

export type SharesRepo = ReturnType<typeof sharesRepo>;
