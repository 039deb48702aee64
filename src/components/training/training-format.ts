import type { MyClass } from '@shared/schemas/training.schema';

type AssignmentStatus = MyClass['assignments'][number]['status'];

/** Small wording helpers shared by the training pages. */
export function dueText(dueAt: string | null): string {
  if (!dueAt) return 'No due date';
  return `Due ${new Date(dueAt).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })}`;
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
