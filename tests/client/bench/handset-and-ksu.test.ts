import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { PlanSchema } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import HandsetPanel from '@/components/bench/HandsetPanel.vue';
import KsuNode from '@/components/bench/nodes/KsuNode.vue';
import { benchWith, mountNode } from './bench-fixture';

describe('HandsetPanel', () => {
  it('captions both dial tones when the handset is across two joined lines, and dials digits', async () => {
    const store = benchWith(PlanSchema.parse(demo));
    // The demo's hands-free wiring parallels the sets' common talk pairs: a set latched on line 1 and another
    // on line 5 put both lines on one handset (the fault this product exists to find).
    store.operate({ kind: 'press-key', set: 'front-counter', key: 1 });
    store.operate({ kind: 'press-key', set: 'workroom', key: 5 });
    store.operate({ kind: 'lift-handset', set: 'workroom' });
    store.select('workroom');
    const wrapper = mount(HandsetPanel);
    // An idle line seized off hook returns dial tone from its own exchange (common practice, no published source).
    expect(wrapper.get('[data-testid="heard-caption"]').text()).toBe(
      'Hears dial tone on line 1 + dial tone on line 5.',
    );

    await wrapper.get('[data-testid="dial-7"]').trigger('click');
    const lines = store.sim?.lines.filter((l) => l.far.digits === '7').map((l) => l.line);
    // Digits go onto every line the handset is on (the engine's dial action).
    expect(lines).toEqual([1, 5]);
  });

  it('says the handset hears nothing on hook and keeps the dial pad shut', () => {
    const store = benchWith(PlanSchema.parse(demo));
    store.select('workroom');
    const wrapper = mount(HandsetPanel);
    expect(wrapper.get('[data-testid="heard-caption"]').text()).toBe(
      'Workroom is on hook: the handset hears nothing.',
    );
    expect(wrapper.get('[data-testid="dial-1"]').attributes('disabled')).toBeDefined();
  });
});

describe('KsuNode', () => {
  it('emits the far party and intercom actions for each line and station', async () => {
    const store = benchWith(PlanSchema.parse(demo));
    const wrapper = mountNode(KsuNode, store.plan!.ksu.id, 'ksu', { width: 250, height: 300 });
    expect(wrapper.findAll('[data-testid^="ksu-line-"]')).toHaveLength(store.plan!.ksu.lines.length);
    await wrapper.get('[data-testid="ring-line-2"]').trigger('click');
    await wrapper.get('[data-testid="far-answer-3"]').trigger('click');
    await wrapper.get('[data-testid="far-hang-up-4"]').trigger('click');
    const station = store.plan!.ksu.stations[0];
    await wrapper.get(`[data-testid="intercom-${station.id}"]`).trigger('click');
    expect(wrapper.emitted('operate')).toEqual([
      [{ kind: 'ring-line', line: 2 }],
      [{ kind: 'far-answer', line: 3 }],
      [{ kind: 'far-hang-up', line: 4 }],
      [{ kind: 'intercom-call', station: station.id }],
    ]);

    store.operate({ kind: 'ring-line', line: 2 });
    await wrapper.vm.$nextTick();
    // A ringing line offers to stop ringing instead of ringing again.
    expect(wrapper.find('[data-testid="ring-line-2"]').exists()).toBe(false);
    expect(wrapper.get('[data-testid="ksu-line-2"]').text()).toContain('ringing');
  });
});
