/**
 * The Bench's undo and redo history as plain values: history and the current document in, history and the
 * document to show out. Each entry keeps the document as it was before the labelled edit, so undo is a swap.
 */
import type { Plan } from '@shared/engine';

export interface HistoryEntry {
  label: string;
  plan: Plan;
}

export interface History {
  past: HistoryEntry[];
  future: HistoryEntry[];
}

/** How many edits undo can walk back; older ones are dropped so a long session does not grow without bound. */
export const HISTORY_LIMIT = 200;

export const emptyHistory = (): History => ({ past: [], future: [] });

/** After a labelled edit away from `current`: it joins the past and the redo branch is dropped. */
export function recordEdit(history: History, label: string, current: Plan): History {
  return { past: [...history.past, { label, plan: current }].slice(-HISTORY_LIMIT), future: [] };
}

/** One step back from `current`, or null when there is nothing to undo. */
export function undoStep(history: History, current: Plan): { history: History; plan: Plan } | null {
  const entry = history.past.at(-1);
  if (!entry) return null;
  return {
    history: {
      past: history.past.slice(0, -1),
      future: [...history.future, { label: entry.label, plan: current }],
    },
    plan: entry.plan,
  };
}

/** One step forward again from `current`, or null when there is nothing to redo. */
export function redoStep(history: History, current: Plan): { history: History; plan: Plan } | null {
  const entry = history.future.at(-1);
  if (!entry) return null;
  return {
    history: {
      past: [...history.past, { label: entry.label, plan: current }],
      future: history.future.slice(0, -1),
    },
    plan: entry.plan,
  };
}
