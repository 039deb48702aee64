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
