/** The cost line of a change, on the Cure panel and the work sheet: one consistent sentence, never "none" and a loss. */
import { describe, expect, it } from 'vitest';
import { leadChangeWork, PlanSchema } from '@shared/engine';
import { costWords } from '@shared/work-sheet/cost-words';
import { changeCost } from '@/components/bench/cure-words';
import { twoSetPlan } from './bench/bench-fixture';

describe('cost words', () => {
  it('says a lift on a set without its add-on loses nothing today but rules the add-on out later', () => {
    // The engine's own brief for that lift (shared/engine/model/lead-changes.ts, effect "no-add-on").
    const line = changeCost('none: Back room has no hands-free add-on (it can no longer take one)');
    expect(line).toBe(
      'Cost: Nothing stops working today (Back room has no hands-free add-on), but Back room could not take one later without putting the leads back.',
    );
    expect(line).not.toMatch(/Cost: none/i);
  });

  it('leaves every other cost as the engine says it, as a sentence', () => {
    const plan = PlanSchema.parse(twoSetPlan());
    const set = plan.sets[0]!;
    // Pair 1 carries line 1's talk leads on every set (templates/README.md pair plan): lifting it loses line 1.
    const work = leadChangeWork(plan, set.id, { kind: 'lift', pair: 1, conductor: 'both' })!;
    expect(costWords(work.cost)).toBe(work.cost);
    expect(costWords('the set loses line 2')).toBe('The set loses line 2.');
  });
});
