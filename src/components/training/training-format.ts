import { momentText } from '@/formats/dates';
import type { MyClass } from '@shared/schemas/training.schema';

type AssignmentStatus = MyClass['assignments'][number]['status'];

/** Standings in which a trainee still owes the work: past its due date, it is overdue. */
const OWED: ReadonlySet<AssignmentStatus> = new Set(['not-started', 'working']);

/**
 * Small wording helpers shared by the training pages. With the trainee's status, an assignment still owed past its
 * due date says so.
 */
export function dueText(dueAt: string | null, status?: AssignmentStatus, now = Date.now()): string {
  if (!dueAt) return 'No due date';
  const when = momentText(dueAt);
  return isOverdue(dueAt, status, now) ? `Overdue: was due ${when}` : `Due ${when}`;
}

/** Past its due date while the trainee still owes the work (never without a trainee's status). */
function isOverdue(dueAt: string, status: AssignmentStatus | undefined, now: number): boolean {
  return !!status && OWED.has(status) && Date.parse(dueAt) < now;
}

/** The due date in a column headed "Due": the day and time, marked while the work is owed past it. */
export function dueCell(dueAt: string | null, status?: AssignmentStatus, now = Date.now()): string {
  if (!dueAt) return '—';
  return isOverdue(dueAt, status, now) ? `${momentText(dueAt)} (overdue)` : momentText(dueAt);
}

/** Assignments soonest due first, those without a due date last; equal dates keep the order they were set in. */
export function byDueDate<T extends { dueAt: string | null }>(items: readonly T[]): T[] {
  const at = (x: T) => (x.dueAt ? Date.parse(x.dueAt) : Number.POSITIVE_INFINITY);
  return [...items].sort((a, b) => at(a) - at(b) || 0);
}

export function minutesText(ms: number | null): string {
  return ms === null ? '—' : `${Math.max(1, Math.ceil(ms / 60_000))} min`;
}

/** A trainee's standing on an assignment, in words. */
const STATUS_WORDS: Record<AssignmentStatus, string> = {
  'not-started': 'Not started',
  working: 'In progress',
  passed: 'Passed',
  failed: 'No attempts left',
  open: 'Open',
};

export function statusText(status: AssignmentStatus): string {
  return STATUS_WORDS[status];
}
