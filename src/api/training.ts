/** Training API: classes, invitations, puzzles, runs, demonstrations, gradebook. Every answer parsed by its schema. */
import { z } from 'zod';
import type { SimAction } from '@shared/engine';
import {
  AcceptedSchema,
  AssignmentSchema,
  ClassDetailSchema,
  ClassListSchema,
  DemonstrationListSchema,
  DemonstrationRecordSchema,
  ExplanationSchema,
  GradebookSchema,
  InvitationInfoSchema,
  InviteResultSchema,
  LibraryListSchema,
  MyClassListSchema,
  ProgressSchema,
  PuzzleListSchema,
  PuzzleRecordSchema,
  RunViewSchema,
  SubmissionResultSchema,
  type AcceptInvitation,
  type CreateAssignment,
  type Submission,
} from '@shared/schemas/training.schema';
import type { DemonstrationSpec } from '@shared/training/demonstration.schema';
import type { PuzzleSpecInput } from '@shared/training/puzzle.schema';
import { request } from './client';

const base = '/api/training';
const e = encodeURIComponent;
const CheckSchema = z.object({
  ok: z.boolean(),
  problems: z.array(z.string()),
  symptoms: z.array(z.string()),
});

export const trainingApi = {
  classes: () => request('GET', `${base}/classes`, ClassListSchema).then((r) => r.items),
  createClass: (name: string) => request('POST', `${base}/classes`, ClassDetailSchema, { name }),
  classDetail: (id: string) => request('GET', `${base}/classes/${e(id)}`, ClassDetailSchema),
  removeClass: (id: string) => request('DELETE', `${base}/classes/${e(id)}`, null),
  invite: (id: string, emails: string[]) =>
    request('POST', `${base}/classes/${e(id)}/invitations`, InviteResultSchema, { emails }),
  resend: (id: string, invitationId: string) =>
    request('POST', `${base}/classes/${e(id)}/invitations/${e(invitationId)}/resend`, InviteResultSchema),
  revoke: (id: string, invitationId: string) =>
    request('DELETE', `${base}/classes/${e(id)}/invitations/${e(invitationId)}`, null),
  removeMember: (id: string, userId: string) =>
    request('DELETE', `${base}/classes/${e(id)}/members/${e(userId)}`, null),
  assign: (id: string, input: CreateAssignment) =>
    request('POST', `${base}/classes/${e(id)}/assignments`, AssignmentSchema, input),
  unassign: (id: string, assignmentId: string) =>
    request('DELETE', `${base}/classes/${e(id)}/assignments/${e(assignmentId)}`, null),
  gradebook: (id: string) => request('GET', `${base}/classes/${e(id)}/gradebook`, GradebookSchema),
  gradebookCsvUrl: (id: string) => `${base}/classes/${e(id)}/gradebook.csv`,

  invitation: (token: string) => request('GET', `${base}/invitations/${e(token)}`, InvitationInfoSchema),
  accept: (token: string, input: AcceptInvitation) =>
    request('POST', `${base}/invitations/${e(token)}/accept`, AcceptedSchema, input),

  myClasses: () => request('GET', `${base}/my/classes`, MyClassListSchema).then((r) => r.items),
  myProgress: () => request('GET', `${base}/my/progress`, ProgressSchema).then((r) => r.items),

  library: () => request('GET', `${base}/library`, LibraryListSchema).then((r) => r.items),
  copyFromLibrary: (slug: string) =>
    request('POST', `${base}/puzzles/from-library`, PuzzleRecordSchema, { slug }),
  puzzles: () => request('GET', `${base}/puzzles`, PuzzleListSchema).then((r) => r.items),
  checkPuzzle: (spec: PuzzleSpecInput) => request('POST', `${base}/puzzles/check`, CheckSchema, { spec }),
  createPuzzle: (spec: PuzzleSpecInput) => request('POST', `${base}/puzzles`, PuzzleRecordSchema, { spec }),
  removePuzzle: (id: string) => request('DELETE', `${base}/puzzles/${e(id)}`, null),

  startRun: (assignmentId: string) =>
    request('POST', `${base}/assignments/${e(assignmentId)}/run`, RunViewSchema),
  act: (runId: string, action: SimAction) =>
    request('POST', `${base}/runs/${e(runId)}/actions`, RunViewSchema, { action }),
  resetRun: (runId: string) => request('POST', `${base}/runs/${e(runId)}/reset`, RunViewSchema),
  submit: (runId: string, submission: Submission) =>
    request('POST', `${base}/runs/${e(runId)}/submit`, SubmissionResultSchema, submission),
  explanation: (runId: string) => request('GET', `${base}/runs/${e(runId)}/explanation`, ExplanationSchema),

  demonstrations: () =>
    request('GET', `${base}/demonstrations`, DemonstrationListSchema).then((r) => r.items),
  demonstration: (id: string) => request('GET', `${base}/demonstrations/${e(id)}`, DemonstrationRecordSchema),
  assignedDemonstration: (assignmentId: string) =>
    request('GET', `${base}/assignments/${e(assignmentId)}/demonstration`, DemonstrationRecordSchema),
  saveDemonstration: (spec: DemonstrationSpec, id?: string) =>
    id
      ? request('PUT', `${base}/demonstrations/${e(id)}`, DemonstrationRecordSchema, { spec })
      : request('POST', `${base}/demonstrations`, DemonstrationRecordSchema, { spec }),
  removeDemonstration: (id: string) => request('DELETE', `${base}/demonstrations/${e(id)}`, null),
};
