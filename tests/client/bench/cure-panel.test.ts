import { describe, expect, it } from 'vitest';
import { nextTick } from 'vue';
import { PlanSchema } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import CurePanel from '@/components/bench/CurePanel.vue';
import { benchWith } from './bench-fixture';
import { untilIdle, workerHost } from './worker-host';

/*
 * The demo plan: Front counter (with its hands-free add-on) and Workroom, two hands-free six-key sets bridged on one
 * cable, so their private leads on pairs 23–25 join lines 7–9 wiring (the standard cross-connect carries lines 6–9
 * on pairs 22–25: common practice, no published source), and both buzzers share pair 18. The fewest changes that
 * clear it by hand: lift those three pairs in one set, move one buzzer to a spare pair — 4 (worked example in
 * shared/engine/search/README.md).
 */
async function runCure(choose: (t: ReturnType<typeof workerHost>) => Promise<void> = async () => {}) {
  const store = benchWith(PlanSchema.parse(demo));
  const t = workerHost(CurePanel);
  await choose(t);
  await t.wrapper.get('[data-testid="cure-run"]').trigger('click');
  await untilIdle(t.worker);
  await nextTick();
  return { t, store, result: t.worker.cureResult.value! };
}

describe('Cure panel', () => {
  it('states the proof of minimality in plain words', async () => {
    const { t, result } = await runCure();
    expect(result.ok).toBe(true);
    expect(result.changes).toHaveLength(4);
    const proof = t.wrapper.get('[data-testid="cure-proof"]').text();
    expect(proof).toMatch(/^No cure with fewer than 4 changes exists: the solver proved it/);
    expect(proof).toContain('with every finding of a complete sweep as a constraint');
    expect(t.wrapper.findAll('[data-testid="cure-changes"] li')).toHaveLength(4);
    expect(t.wrapper.find('[data-testid="cure-blocking"]').exists()).toBe(false);
  }, 60_000);

  it('passes the choices to the worker and shows what each one costs', async () => {
    const { t, result } = await runCure(async (t) => {
      await t.wrapper.get('[data-testid="cure-keep-front-counter"]').trigger('click');
      await t.wrapper.get('[data-testid="cure-untouched-workroom"]').trigger('click');
    });
    const request = t.made[0].requests[0];
    expect(request.type === 'cure' && request.choices).toEqual({
      keepAddOn: ['front-counter'],
      untouched: ['workroom'],
    });
    // Only the demo's Front counter has an add-on, so only it offers to keep one.
    expect(t.wrapper.find('[data-testid="cure-keep-workroom"]').exists()).toBe(false);
    // With Workroom untouched and the add-on kept, the pairs 23–25 joining the lines can only be lifted on the
    // Front counter side, which its kept add-on needs: no cure.
    expect(result.ok).toBe(false);
    expect(result.choices.map((c) => `${c.option} ${c.set}`)).toEqual([
      'keep-add-on front-counter',
      'untouched workroom',
    ]);
    const untouched = t.wrapper.get('[data-testid="cure-cost-untouched-workroom"]').text();
    // Without "untouched" the cure lifts in Workroom: the 4-change cure above.
    expect(untouched).toBe(
      'Leaving Workroom untouched stands in the way: without it, a cure of 4 changes exists.',
    );
    const blocking = t.wrapper.get('[data-testid="cure-blocking"]').text();
    expect(blocking).toContain('Cannot be cleared');
    expect(blocking).toContain(`Why: ${result.blocking!.reason}.`);
    const what = result.blocking!.finding?.message ?? result.after[0]!.message;
    expect(blocking).toContain(what);
  }, 120_000);
});
