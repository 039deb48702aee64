/** Classes, their members, invitations and assignments: the only place that reads or writes those tables. */
import type {
  Assignment,
  ClassDetail,
  ClassSummary,
  RosterEntry,
} from '../../shared/schemas/training.schema';
import type { Database } from '../db/database';
import { newId } from '../users/users.repo';

interface ClassRow {
  id: string;
  owner_id: string;
  name: string;
  created_at: string;
}

export interface InvitationRow {
  id: string;
  class_id: string;
  email: string;
  token_hash: string;
  expires_at: string;
  sent_at: string;
  accepted_at: string | null;
  accepted_by: string | null;
  revoked_at: string | null;
}

interface AssignmentRow {
  id: string;
  class_id: string;
  kind: 'puzzle' | 'demonstration';
  puzzle_id: string | null;
  demonstration_id: string | null;
  due_at: string | null;
  created_at: string;
  title: string;
  level: number | null;
}

export interface ClassRecord {
  id: string;
  ownerId: string;
  name: string;
  ownerName: string;
  createdAt: string;
}

export function invitationStatus(row: InvitationRow, now = new Date()): RosterEntry['status'] {
  if (row.accepted_at) return 'accepted';
  if (row.revoked_at) return 'revoked';
  return Date.parse(row.expires_at) <= now.getTime() ? 'expired' : 'pending';
}

const toAssignment = (row: AssignmentRow): Assignment => ({
  id: row.id,
  classId: row.class_id,
  kind: row.kind,
  itemId: (row.kind === 'puzzle' ? row.puzzle_id : row.demonstration_id) ?? '',
  title: row.title,
  level: row.kind === 'puzzle' ? ((row.level ?? 1) as 1 | 2 | 3) : null,
  dueAt: row.due_at,
});

export function classesRepo(db: Database) {
  const assignmentsQuery = () =>
    db('training_assignments as a')
      .leftJoin('training_puzzles as p', 'p.id', 'a.puzzle_id')
      .leftJoin('training_demonstrations as d', 'd.id', 'a.demonstration_id')
      .select('a.*', db.raw('coalesce(p.title, d.title) as title'), 'p.level as level');

  async function summaries(where: { ownerId?: string; classId?: string }): Promise<(ClassSummary & { ownerId: string })[]> {
    const rows = await db('training_classes as c')
      .join('users as u', 'u.id', 'c.owner_id')
      .modify((qb) => {
        if (where.ownerId) qb.where('c.owner_id', where.ownerId);
        if (where.classId) qb.where('c.id', where.classId);
      })
      .select('c.*', 'u.display_name as owner_name')
      .orderBy([{ column: 'c.created_at', order: 'desc' }, { column: 'c.id' }]);
    const now = new Date();
    const out = [];
    for (const row of rows as (ClassRow & { owner_name: string })[]) {
      const members = await db('training_members').where({ class_id: row.id }).count<{ n: number }[]>({ n: '*' }).first();
      const invitations = await db<InvitationRow>('training_invitations').where({ class_id: row.id });
      out.push({
        id: row.id,
        ownerId: row.owner_id,
        name: row.name,
        ownerName: row.owner_name,
        traineeCount: Number(members?.n ?? 0),
        pendingCount: invitations.filter((i) => invitationStatus(i, now) === 'pending').length,
        createdAt: row.created_at,
      });
    }
    return out;
  }

  return {
    /** Every class for an admin (no owner), else the owner's. */
    async list(ownerId?: string): Promise<ClassSummary[]> {
      return (await summaries({ ownerId })).map(({ ownerId: _o, ...s }) => s);
    },

    async find(id: string): Promise<ClassRecord | null> {
      const row = await db('training_classes as c')
        .join('users as u', 'u.id', 'c.owner_id')
        .where('c.id', id)
        .first<(ClassRow & { owner_name: string }) | undefined>('c.*', 'u.display_name as owner_name');
      return row ? { id: row.id, ownerId: row.owner_id, name: row.name, ownerName: row.owner_name, createdAt: row.created_at } : null;
    },

    async create(ownerId: string, name: string): Promise<string> {
      const id = newId();
      await db('training_classes').insert({ id, owner_id: ownerId, name, created_at: new Date().toISOString() });
      return id;
    },

    async remove(id: string): Promise<void> {
      await db('training_classes').where({ id }).delete();
    },

    async detail(id: string): Promise<ClassDetail | null> {
      const [summary] = await summaries({ classId: id });
      if (!summary) return null;
      const { ownerId: _o, ...rest } = summary;
      const members = await db('training_members as m')
        .join('users as u', 'u.id', 'm.user_id')
        .where('m.class_id', id)
        .orderBy('u.display_name')
        .select('m.user_id', 'm.joined_at', 'u.email', 'u.display_name');
      const invitations = await db<InvitationRow>('training_invitations')
        .where({ class_id: id })
        .whereNull('accepted_at')
        .orderBy('sent_at', 'desc');
      const roster: RosterEntry[] = [
        ...members.map((m: { user_id: string; joined_at: string; email: string; display_name: string }) => ({
          kind: 'member' as const,
          userId: m.user_id,
          invitationId: null,
          email: m.email,
          displayName: m.display_name,
          status: 'joined' as const,
          joinedAt: m.joined_at,
          expiresAt: null,
        })),
        ...invitations
          .filter((i) => !i.revoked_at)
          .map((i) => ({
            kind: 'invitation' as const,
            userId: null,
            invitationId: i.id,
            email: i.email,
            displayName: null,
            status: invitationStatus(i),
            joinedAt: null,
            expiresAt: i.expires_at,
          })),
      ];
      return { ...rest, roster, assignments: await this.assignments(id) };
    },

    async isMember(classId: string, userId: string): Promise<boolean> {
      return !!(await db('training_members').where({ class_id: classId, user_id: userId }).first());
    },

    async addMember(classId: string, userId: string): Promise<void> {
      await db('training_members')
        .insert({ class_id: classId, user_id: userId, joined_at: new Date().toISOString() })
        .onConflict(['class_id', 'user_id'])
        .ignore();
    },

    async removeMember(classId: string, userId: string): Promise<boolean> {
      return (await db('training_members').where({ class_id: classId, user_id: userId }).delete()) > 0;
    },

    /** Classes a user belongs to, with their instructor's name. */
    async classesOf(userId: string): Promise<{ id: string; name: string; instructorName: string }[]> {
      return db('training_members as m')
        .join('training_classes as c', 'c.id', 'm.class_id')
        .join('users as u', 'u.id', 'c.owner_id')
        .where('m.user_id', userId)
        .orderBy('c.name')
        .select('c.id', 'c.name', 'u.display_name as instructorName');
    },

    async createInvitation(classId: string, email: string, tokenHash: string, expiresAt: string): Promise<string> {
      const id = newId();
      await db('training_invitations').insert({
        id,
        class_id: classId,
        email,
        token_hash: tokenHash,
        expires_at: expiresAt,
        sent_at: new Date().toISOString(),
      });
      return id;
    },

    async invitation(id: string): Promise<InvitationRow | undefined> {
      return db<InvitationRow>('training_invitations').where({ id }).first();
    },

    async invitationByToken(tokenHash: string): Promise<InvitationRow | undefined> {
      return db<InvitationRow>('training_invitations').where({ token_hash: tokenHash }).first();
    },

    /** A fresh token and expiry: the old link stops working. */
    async renewInvitation(id: string, tokenHash: string, expiresAt: string): Promise<void> {
      await db('training_invitations')
        .where({ id })
        .update({ token_hash: tokenHash, expires_at: expiresAt, sent_at: new Date().toISOString() });
    },

    async revokeInvitation(id: string): Promise<void> {
      await db('training_invitations').where({ id }).update({ revoked_at: new Date().toISOString() });
    },

    /** Marks the invitation used; false when it was used, revoked or renewed meanwhile. */
    async consumeInvitation(id: string, tokenHash: string, userId: string): Promise<boolean> {
      const changed = await db('training_invitations')
        .where({ id, token_hash: tokenHash })
        .whereNull('accepted_at')
        .whereNull('revoked_at')
        .update({ accepted_at: new Date().toISOString(), accepted_by: userId });
      return changed > 0;
    },

    async assignments(classId: string): Promise<Assignment[]> {
      const rows = (await assignmentsQuery()
        .where('a.class_id', classId)
        .orderBy([{ column: 'a.created_at' }, { column: 'a.id' }])) as AssignmentRow[];
      return rows.map(toAssignment);
    },

    async assignment(id: string): Promise<Assignment | null> {
      const row = (await assignmentsQuery().where('a.id', id).first()) as AssignmentRow | undefined;
      return row ? toAssignment(row) : null;
    },

    async createAssignment(input: { classId: string; kind: 'puzzle' | 'demonstration'; itemId: string; dueAt: string | null }): Promise<string> {
      const id = newId();
      await db('training_assignments').insert({
        id,
        class_id: input.classId,
        kind: input.kind,
        puzzle_id: input.kind === 'puzzle' ? input.itemId : null,
        demonstration_id: input.kind === 'demonstration' ? input.itemId : null,
        due_at: input.dueAt,
        created_at: new Date().toISOString(),
      });
      return id;
    },

    async removeAssignment(classId: string, id: string): Promise<boolean> {
      return (await db('training_assignments').where({ id, class_id: classId }).delete()) > 0;
    },

    async members(classId: string): Promise<{ userId: string; displayName: string; email: string }[]> {
      return db('training_members as m')
        .join('users as u', 'u.id', 'm.user_id')
        .where('m.class_id', classId)
        .orderBy('u.display_name')
        .select('m.user_id as userId', 'u.display_name as displayName', 'u.email');
    },
  };
}

export type ClassesRepo = ReturnType<typeof classesRepo>;
