/**
 * Classes (instructors and admins), invitations (public link, single use, expiring) and the trainee's own classes.
 * A class of another instructor answers 404.
 */
import { createHash, randomBytes } from 'node:crypto';
import { Router, type Response } from 'express';
import type { Logger } from 'pino';
import { z } from 'zod';
import type { User } from '../../shared/schemas/auth.schema';
import { StrongPasswordSchema } from '../../shared/schemas/password-strength';
import {
  AcceptInvitationSchema,
  CreateAssignmentSchema,
  CreateClassSchema,
  InviteSchema,
  type InvitationInfo,
  type InviteResult,
  type MyClass,
} from '../../shared/schemas/training.schema';
import { currentUser, requireRole, requireUser } from '../http/auth.middleware';
import type { SessionService } from '../auth/sessions';
import { hashPassword } from '../auth/password';
import { HttpError, notFound } from '../http/http-error';
import { parseBody, parseParams } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import type { UsersRepo } from '../users/users.repo';
import { invitationStatus, type ClassesRepo } from './classes.repo';
import type { PuzzlesRepo } from './puzzles.repo';
import { invitationMail } from './training-mail';

/** How long an invitation link works. */
export const INVITATION_DAYS = 7;

const Id = z.string().min(1).max(64);
const ClassParams = z.object({ id: Id });
const InvitationParams = z.object({ id: Id, invitationId: Id });
const MemberParams = z.object({ id: Id, userId: Id });
const AssignmentParams = z.object({ id: Id, assignmentId: Id });
const TokenParams = z.object({ token: z.string().min(20).max(100) });

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
const expiry = () => new Date(Date.now() + INVITATION_DAYS * 24 * 3600_000).toISOString();

export const manages = (user: User, ownerId: string) => user.role === 'admin' || user.id === ownerId;

/** Who may use the teaching routes. */
export const staffOnly = requireRole('instructor', 'admin');

/** The item when the signed-in user owns it (or is an admin); otherwise 404, as if it did not exist. */
export async function managedOr404<T extends { ownerId: string }>(res: Response, found: Promise<T | null>, what: string): Promise<T> {
  const item = await found;
  if (!item || !manages(currentUser(res), item.ownerId)) throw notFound(what);
  return item;
}

export interface ClassesRoutesDeps {
  classes: ClassesRepo;
  puzzles: PuzzlesRepo;
  users: UsersRepo;
  mailer: Mailer;
  sessions: SessionService;
  logger: Logger;
  publicOrigin: string;
}

const invalidLink = () =>
  new HttpError(
    404,
    'NOT_FOUND',
    'This invitation link no longer works: it was used, withdrawn, replaced or has expired. Ask your instructor for a new one.',
  );

export function classesRoutes({ classes, puzzles, users, mailer, sessions, logger, publicOrigin }: ClassesRoutesDeps): Router {
  const router = Router();
  const staff = staffOnly;
  const managedClass = (res: Response, id: string) => managedOr404(res, classes.find(id), 'That class');

  async function sendInvitation(classId: string, className: string, instructorName: string, email: string, invitationId?: string) {
    const token = randomBytes(32).toString('base64url');
    const expiresAt = expiry();
    if (invitationId) await classes.renewInvitation(invitationId, hashToken(token), expiresAt);
    else await classes.createInvitation(classId, email, hashToken(token), expiresAt);
    const link = `${publicOrigin}/drills/join/${token}`;
    try {
      await mailer.send(invitationMail({ to: email, className, instructorName, link, expiresAt }));
      return true;
    } catch (err) {
      logger.error({ err, classId }, 'invitation mail not sent');
      return false;
    }
  }

  // ------------------------------------------------------------------ instructors and admins

  router.get('/classes', staff, async (_req, res) => {
    const user = currentUser(res);
    res.json({ items: await classes.list(user.role === 'admin' ? undefined : user.id) });
  });

  router.post('/classes', staff, async (req, res) => {
    const { name } = parseBody(CreateClassSchema, req);
    const id = await classes.create(currentUser(res).id, name);
    res.status(201).json(await classes.detail(id));
  });

  router.get('/classes/:id', staff, async (req, res) => {
    const { id } = parseParams(ClassParams, req);
    await managedClass(res, id);
    res.json(await classes.detail(id));
  });

  router.delete('/classes/:id', staff, async (req, res) => {
    const { id } = parseParams(ClassParams, req);
    await managedClass(res, id);
    await classes.remove(id);
    res.status(204).end();
  });

  router.post('/classes/:id/invitations', staff, async (req, res) => {
    const { id } = parseParams(ClassParams, req);
    const { emails } = parseBody(InviteSchema, req);
    const found = await managedClass(res, id);
    const detail = (await classes.detail(id))!;
    const result: InviteResult = { sent: [], notSent: [], alreadyMembers: [] };
    for (const email of [...new Set(emails)]) {
      if (detail.roster.some((r) => r.kind === 'member' && r.email === email)) {
        result.alreadyMembers.push(email);
        continue;
      }
      // A new invitation replaces any earlier one to the same address.
      for (const old of detail.roster.filter((r) => r.kind === 'invitation' && r.email === email))
        await classes.revokeInvitation(old.invitationId!);
      const sent = await sendInvitation(id, found.name, found.ownerName, email);
      (sent ? result.sent : result.notSent).push(email);
    }
    res.status(201).json(result);
  });

  router.post('/classes/:id/invitations/:invitationId/resend', staff, async (req, res) => {
    const { id, invitationId } = parseParams(InvitationParams, req);
    const found = await managedClass(res, id);
    const invitation = await classes.invitation(invitationId);
    if (!invitation || invitation.class_id !== id) throw notFound('That invitation');
    const status = invitationStatus(invitation);
    if (status === 'accepted' || status === 'revoked')
      throw new HttpError(409, 'CONFLICT', `That invitation was ${status}; it cannot be sent again.`);
    const sent = await sendInvitation(id, found.name, found.ownerName, invitation.email, invitation.id);
    const result: InviteResult = { sent: sent ? [invitation.email] : [], notSent: sent ? [] : [invitation.email], alreadyMembers: [] };
    res.json(result);
  });

  router.delete('/classes/:id/invitations/:invitationId', staff, async (req, res) => {
    const { id, invitationId } = parseParams(InvitationParams, req);
    await managedClass(res, id);
    const invitation = await classes.invitation(invitationId);
    if (!invitation || invitation.class_id !== id) throw notFound('That invitation');
    await classes.revokeInvitation(invitationId);
    res.status(204).end();
  });

  router.delete('/classes/:id/members/:userId', staff, async (req, res) => {
    const { id, userId } = parseParams(MemberParams, req);
    await managedClass(res, id);
    if (!(await classes.removeMember(id, userId))) throw notFound('That trainee');
    res.status(204).end();
  });

  router.post('/classes/:id/assignments', staff, async (req, res) => {
    const { id } = parseParams(ClassParams, req);
    const input = parseBody(CreateAssignmentSchema, req);
    await managedClass(res, id);
    const user = currentUser(res);
    const item =
      input.kind === 'puzzle' ? await puzzles.findPuzzle(input.itemId) : await puzzles.findDemonstration(input.itemId);
    if (!item || !manages(user, item.ownerId))
      throw new HttpError(400, 'VALIDATION_FAILED', `Choose one of your own ${input.kind === 'puzzle' ? 'puzzles' : 'demonstrations'}.`, {
        itemId: ['Not one of yours'],
      });
    const assignmentId = await classes.createAssignment({ classId: id, ...input });
    res.status(201).json(await classes.assignment(assignmentId));
  });

  router.delete('/classes/:id/assignments/:assignmentId', staff, async (req, res) => {
    const { id, assignmentId } = parseParams(AssignmentParams, req);
    await managedClass(res, id);
    if (!(await classes.removeAssignment(id, assignmentId))) throw notFound('That assignment');
    res.status(204).end();
  });

  // ------------------------------------------------------------------ invitation links (public)

  async function pendingInvitation(token: string) {
    const invitation = await classes.invitationByToken(hashToken(token));
    if (!invitation || invitationStatus(invitation) !== 'pending') throw invalidLink();
    const found = (await classes.find(invitation.class_id))!;
    return { invitation, found };
  }

  router.get('/invitations/:token', async (req, res) => {
    const { token } = parseParams(TokenParams, req);
    const { invitation, found } = await pendingInvitation(token);
    const body: InvitationInfo = {
      className: found.name,
      instructorName: found.ownerName,
      email: invitation.email,
      accountExists: !!(await users.findByEmail(invitation.email)),
    };
    res.json(body);
  });

  router.post('/invitations/:token/accept', async (req, res) => {
    const { token } = parseParams(TokenParams, req);
    const input = parseBody(AcceptInvitationSchema, req);
    const { invitation, found } = await pendingInvitation(token);
    let user = res.locals.user;
    if (user && user.email !== invitation.email)
      throw new HttpError(403, 'FORBIDDEN', `This invitation was sent to ${invitation.email}. Sign in with that account to accept it.`);
    if (!user) {
      if (await users.findByEmail(invitation.email))
        throw new HttpError(401, 'UNAUTHENTICATED', `An account for ${invitation.email} exists: sign in, then open the link again.`);
      const details: Record<string, string[]> = {};
      if (!input.displayName) details.displayName = ['Enter your name'];
      const password = StrongPasswordSchema.safeParse(input.password);
      if (!password.success) details.password = [password.error.issues[0].message];
      if (Object.keys(details).length)
        throw new HttpError(400, 'VALIDATION_FAILED', 'Choose your name and a password to create your trainee account.', details);
      user = await users.create({
        email: invitation.email,
        displayName: input.displayName!,
        role: 'trainee',
        passwordHash: await hashPassword(input.password!),
      });
      if (!user) throw new HttpError(409, 'EMAIL_TAKEN', 'An account with that e-mail was just created. Sign in instead.');
      await sessions.start(res, user, { userAgent: req.get('user-agent') });
    }
    if (!(await classes.consumeInvitation(invitation.id, invitation.token_hash, user.id))) throw invalidLink();
    await classes.addMember(found.id, user.id);
    res.json({ classId: found.id, className: found.name });
  });

  // ------------------------------------------------------------------ the signed-in member's own classes

  router.get('/my/classes', requireUser, async (_req, res) => {
    const user = currentUser(res);
    const items: MyClass[] = [];
    const runs = await puzzles.runsOf({ userId: user.id });
    for (const c of await classes.classesOf(user.id)) {
      const assignments = await classes.assignments(c.id);
      items.push({
        ...c,
        assignments: assignments.map((a) => {
          const run = runs.find((r) => r.assignmentId === a.id);
          return {
            ...a,
            bestScore: run?.bestScore ?? null,
            status: a.kind === 'demonstration' ? 'open' : (run?.status ?? 'not-started'),
            runId: run?.id ?? null,
          };
        }),
      });
    }
    res.json({ items });
  });

  return router;
}
