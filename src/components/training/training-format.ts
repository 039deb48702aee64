/** Small wording helpers shared by the training pages. */
export function dueText(dueAt: string | null): string {
  if (!dueAt) return 'No due date';
  return `Due ${new Date(dueAt).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })}`;
}

export function minutesText(ms: number | null): string {
  return ms === null ? '—' : `${Math.max(1, Math.ceil(ms / 60_000))} min`;
}

/** A trainee's standing on an assignment, in words (the FaultHunt page says "No attempts left" for a failed one). */
const STATUS_WORDS = {
  'not-started': 'Not started',
  working: 'In progress',
  passed: 'Passed',
  failed: 'No attempts left',
  open: 'Open',
} as const;

export function statusText(status: keyof typeof STATUS_WORDS): string {
  return STATUS_WORDS[status];
}
