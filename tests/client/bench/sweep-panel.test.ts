import { describe, expect, it } from 'vitest';
import { defineComponent, h, nextTick } from 'vue';
import { mount } from '@vue/test-utils';
import { cure, PlanSchema, sweep } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import SweepPanel from '@/components/bench/SweepPanel.vue';
import { useSweepWorker } from '@/composables/bench/use-sweep-worker';
import type { SweepReply, SweepRequest } from '@/workers/sweep-protocol';
import { benchWith } from './bench-fixture';

/** Stands in for the Web Worker: same messages, the real engine, answered on the next tick. */
class InlineWorker extends EventTarget {
  terminated = false;
  postMessage(request: SweepRequest) {
    setTimeout(() => {
      if (this.terminated) return;
      const reply: SweepReply =
        request.type === 'sweep'
          ? { type: 'sweep-done', id: request.id, result: sweep(request.plan) }
          : { type: 'cure-done', id: request.id, result: cure(request.plan) };
      this.dispatchEvent(new MessageEvent('message', { data: reply }));
    }, 0);
  }
  terminate() {
    this.terminated = true;
  }
}

function host() {
  let worker!: ReturnType<typeof useSweepWorker>;
  const made: InlineWorker[] = [];
  const Host = defineComponent({
    setup() {
      worker = useSweepWorker(() => {
        const w = new InlineWorker();
        made.push(w);
        return w as unknown as Worker;
      });
      return () => h(SweepPanel, { worker });
    },
  });
  return {
    wrapper: mount(Host),
    made,
    get worker() {
      return worker;
    },
  };
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 5));

describe('SweepPanel', () => {
  it('runs the sweep off the page and puts the canvas into a reproducing state', async () => {
    const store = benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    expect(t.worker.running.value).toBe('sweep');
    await settle();
    await nextTick();
    const expected = t.worker.sweepResult.value!;
    expect(expected.findings.length).toBeGreaterThan(0);
    expect(t.wrapper.get('[data-testid="sweep-summary"]').text()).toContain(
      `${expected.statesVisited} states visited`,
    );
    const rows = t.wrapper.findAll('[data-testid^="sweep-row-"]');
    expect(rows).toHaveLength(expected.findings.length);

    const last = expected.findings.length - 1;
    await t.wrapper.get(`[data-testid="sweep-show-${last}"]`).trigger('click');
    expect(store.sim).toEqual(expected.findings[last].state);
    expect(store.selectedFinding?.code).toBe(expected.findings[last].finding.code);
    // The reproducing state really shows the fault on the canvas.
    expect(store.findings.map((f) => f.code)).toContain(expected.findings[last].finding.code);
  }, 30_000);

  it('shows one kind of finding at a time and keeps each row reproducible', async () => {
    benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await settle();
    await nextTick();
    const all = t.worker.sweepResult.value!.findings;
    // The demo plan joins lines and shares a buzzer pair (common practice, no published source), so the
    // sweep finds more than one kind.
    const joined = all.filter((row) => row.finding.code === 'LINES_JOINED');
    expect(joined.length).toBeGreaterThan(0);
    expect(joined.length).toBeLessThan(all.length);

    await t.wrapper.get('[data-testid="sweep-kind-LINES_JOINED"]').trigger('click');
    const rows = t.wrapper.findAll('[data-testid^="sweep-row-"]');
    expect(rows).toHaveLength(joined.length);
    expect(rows.every((r) => r.attributes('data-testid') === 'sweep-row-LINES_JOINED')).toBe(true);
    // Row buttons keep the finding's place in the whole result.
    const first = all.findIndex((row) => row.finding.code === 'LINES_JOINED');
    expect(rows[0].find(`[data-testid="sweep-show-${first}"]`).exists()).toBe(true);
  }, 30_000);

  it('cancel stops the worker and ignores its late answer', async () => {
    benchWith(PlanSchema.parse(demo));
    const t = host();
    await t.wrapper.get('[data-testid="sweep-run"]').trigger('click');
    await t.wrapper.get('[data-testid="sweep-cancel"]').trigger('click');
    expect(t.made[0].terminated).toBe(true);
    await settle();
    expect(t.worker.running.value).toBeNull();
    expect(t.worker.sweepResult.value).toBeNull();
  });
});
