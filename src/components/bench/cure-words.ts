/** The Cure panel's results in plain words: what each choice costs, the proof of minimality, why no cure exists. */
import type { CureChoiceCost, OptimalCureResult } from '@shared/engine';
import { costWords } from '@shared/work-sheet/cost-words';

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/**
 * One proposed change's cost line, in the same words as the work sheet: a change that costs nothing today but
 * rules out a hands-free add-on later says both, not "none" and a loss in one breath.
 */
export const changeCost = (cost: string): string => `Cost: ${costWords(cost)}`;

/** "Keeping the add-on of Front counter costs 1 more change (4 instead of 3)." */
export function choiceCost(choice: CureChoiceCost, setName: string): string {
  const what =
    choice.option === 'keep-add-on'
      ? `Keeping the hands-free add-on of ${setName}`
      : `Leaving ${setName} untouched`;
  if (!choice.without) return `${what}: there is no cure without this choice either.`;
  const other = choice.without.changes;
  if (choice.extraChanges === null)
    return `${what} stands in the way: without it, a cure of ${plural(other, 'change')} exists.`;
  if (choice.extraChanges > 0)
    return `${what} costs ${plural(choice.extraChanges, 'more change')} (${other + choice.extraChanges} instead of ${other}).`;
  if ((choice.extraWeight ?? 0) > 0)
    return `${what} costs no extra change, but the changes it leaves are dearer (cost rank +${choice.extraWeight}).`;
  return `${what} costs nothing: the cure is the same without it.`;
}

/** The minimality proof as the result states it; null when there is nothing to prove (no cure, or no change). */
export function cureProof(result: OptimalCureResult): string | null {
  const n = result.changes.length;
  if (!result.ok || n === 0) return null;
  const rounds = plural(result.rounds, 'solve-and-sweep round');
  if (result.proofOfMinimality !== 'exhaustive')
    return (
      `Not proven minimal: the sweep of the plan was partial (it did not visit every state), so the solver ` +
      `saw only the findings it reached; ${plural(n, 'change')} is the least that clears those (${rounds}).`
    );
  const checked =
    result.verifiedBy === 'partial-sweep'
      ? ' The cured plan itself was checked by a partial sweep only.'
      : ' A complete sweep of the cured plan shows no finding.';
  return (
    `No cure with fewer than ${plural(n, 'change')} exists: the solver proved it over every lift and buzzer move ` +
    `the cure considers on the findings' conductor paths, with every finding of a complete sweep as a constraint (${rounds}).` +
    checked
  );
}

/** When there is no cure: which findings cannot be cleared, and why. */
export function cureBlocking(result: OptimalCureResult): { what: string[]; reason: string } | null {
  if (result.ok || !result.blocking) return null;
  const named = result.blocking.finding?.message ?? result.blocking.failure?.message;
  return {
    what: named ? [named] : result.after.map((f) => f.message),
    reason: result.blocking.reason,
  };
}
