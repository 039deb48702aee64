/** Small wording helpers shared by the training pages. */
export function dueText(dueAt: string | null): string {
  if (!dueAt) return 'No due date';
  return `Due ${new Date(dueAt).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' })}`;
}

export function minutesText(ms: number | null): string {
  return ms === null ? '—' : `${Math.max(1, Math.ceil(ms / 60_000))} min`;
}
