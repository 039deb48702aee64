/** The admin audit log: who did what to which account, never edited, read newest first. */
import type { AuditEntry } from '../../shared/schemas/account.schema';
import type { Database } from '../db/database';

interface AuditRow {
  id: number;
  at: string;
  actor_id: string | null;
  actor_email: string;
  action: AuditEntry['action'];
  target_id: string | null;
  target_email: string | null;
  detail: string;
}

export function auditRepo(db: Database) {
  return {
    async write(entry: {
      actor: { id: string; email: string };
      action: AuditEntry['action'];
      target?: { id: string; email: string } | null;
      detail?: string;
    }): Promise<void> {
      await db('audit_log').insert({
        at: new Date().toISOString(),
        actor_id: entry.actor.id,
        actor_email: entry.actor.email,
        action: entry.action,
        target_id: entry.target?.id ?? null,
        target_email: entry.target?.email ?? null,
        detail: (entry.detail ?? '').slice(0, 500),
      });
    },

    async list(limit = 200): Promise<AuditEntry[]> {
      const rows = await db<AuditRow>('audit_log').orderBy('id', 'desc').limit(limit);
      return rows.map((r) => ({
        id: r.id,
        at: r.at,
        actorEmail: r.actor_email,
        action: r.action,
        targetEmail: r.target_email,
        detail: r.detail,
      }));
    },
  };
}

export type AuditRepo = ReturnType<typeof auditRepo>;
