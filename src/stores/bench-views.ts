/**
 * What the drawing and the panels read off an evaluation. Every evaluation is a new object, so without this each
 * node would find its own observation in the whole list and every reader would re-render on every key press.
 * Whatever is deep-equal to the previous evaluation's keeps the previous object: a node whose observation did not
 * change, or a Findings list that reads the same, sees the same object and does not re-render.
 */
import { computed, type ComputedRef } from 'vue';
import equal from 'fast-deep-equal';
import { evaluate, type Evaluation, type Finding, type Plan, type SetObservation, type SimState } from '@shared/engine';

/** The engine's evaluation of what is open, or the reason it could not evaluate (shown, never thrown at a render). */
export function evaluationOf(
  plan: Plan | null,
  state: SimState | null,
): { evaluation: Evaluation | null; error: string | null } {
  if (!plan || !state) return { evaluation: null, error: null };
  try {
    return { evaluation: evaluate(plan, state), error: null };
  } catch (err) {
    return { evaluation: null, error: err instanceof Error ? err.message : String(err) };
  }
}

export function keyedKeepingEqual<T>(
  items: readonly T[],
  keyOf: (item: T) => string,
  previous?: ReadonlyMap<string, T>,
): Map<string, T> {
  const next = new Map<string, T>();
  for (const item of items) {
    const key = keyOf(item);
    const before = previous?.get(key);
    next.set(key, before !== undefined && equal(before, item) ? before : item);
  }
  return next;
}

/** Each set's observation by set id, a set whose observation did not change keeping the same object. */
export function keptSetObservations(
  evaluation: () => Evaluation | null,
): ComputedRef<ReadonlyMap<string, SetObservation>> {
  return computed((previous?: ReadonlyMap<string, SetObservation>) =>
    keyedKeepingEqual(evaluation()?.sets ?? [], (s) => s.set, previous),
  );
}

/** The findings, the same array while they read the same: most key presses change no finding. */
export function keptFindings(evaluation: () => Evaluation | null): ComputedRef<Finding[]> {
  return computed((previous?: Finding[]) => {
    const next = evaluation()?.findings ?? [];
    return previous !== undefined && equal(previous, next) ? previous : next;
  });
}
