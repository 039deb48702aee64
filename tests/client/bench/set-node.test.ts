import { describe, expect, it } from 'vitest';
import type { ComponentOptions } from 'vue';
import SetNode from '@/components/bench/nodes/SetNode.vue';
import { benchWith, mountNode } from './bench-fixture';

function mountSet(partId = 'front') {
  return mountNode(SetNode, partId, 'set', { width: 240, height: 200 });
}

/** The back set's node, counting every component of it that patches again (frame, lamps, handset switch). */
function mountCountingBack() {
  const seen = { renders: 0 };
  const countRenders: ComponentOptions = {
    updated() {
      seen.renders++;
    },
  };
  return { seen, wrapper: mountNode(SetNode, 'back', 'set', { width: 240, height: 200 }, [countRenders]) };
}

describe('SetNode', () => {
  it('renders one key per template key, each with a lamp word', () => {
    benchWith();
    const wrapper = mountSet();
    const keys = wrapper.findAll('[data-testid^="key-front-"]');
    // The six-key template: five line keys and a hold key (its title says so; template data in shared/engine/templates).
    expect(keys).toHaveLength(6);
    const lineKeys = keys.slice(0, 5);
    for (const [i, key] of lineKeys.entries()) {
      expect(key.attributes('aria-label')).toBe(`Line ${i + 1} key, lamp dark`);
      // All sets on hook and no ringing: every lamp is dark (common practice, no published source).
      expect(wrapper.get(`[data-testid="lamp-front-${i + 1}"]`).text()).toBe('dark');
    }
    expect(keys[5].attributes('aria-label')).toBe('Hold key');
  });

  it('emits press with the key index and kind, and lift / hang-up from the handset button', async () => {
    const store = benchWith();
    const wrapper = mountSet();
    await wrapper.get('[data-testid="key-front-2"]').trigger('click');
    await wrapper.get('[data-testid="key-front-6"]').trigger('click');
    expect(wrapper.emitted('press')).toEqual([
      [2, 'line'],
      [6, 'hold'],
    ]);

    await wrapper.get('[data-testid="handset-front"]').trigger('click');
    expect(wrapper.emitted('lift')).toHaveLength(1);
    expect(wrapper.emitted('hang-up')).toBeUndefined();

    store.operate({ kind: 'lift-handset', set: 'front' });
    await wrapper.vm.$nextTick();
    await wrapper.get('[data-testid="handset-front"]').trigger('click');
    expect(wrapper.emitted('hang-up')).toHaveLength(1);
  });

  it('shows the engine lamp of a line in use as text and as the cadence class', async () => {
    const store = benchWith();
    const wrapper = mountSet('back');
    store.operate({ kind: 'press-key', set: 'front', key: 1 });
    store.operate({ kind: 'lift-handset', set: 'front' });
    await wrapper.vm.$nextTick();
    const key = wrapper.get('[data-testid="key-back-1"]');
    // A line in use lights its lamp steady on every set bridged to it (common practice, no published source).
    expect(key.attributes('aria-label')).toBe('Line 1 key, lamp steady');
    expect(key.find('[data-cadence="steady"]').exists()).toBe(true);
    expect(wrapper.get('[data-testid="lamp-back-1"]').text()).toBe('steady');
    expect(wrapper.get('[data-testid="key-back-2"]').attributes('aria-label')).toBe('Line 2 key, lamp dark');
  });

  it('does not re-render when only other sets change', async () => {
    const store = benchWith();
    const { seen, wrapper } = mountCountingBack();
    const evaluation = store.evaluation;
    // A line key latched on another set that stays on hook seizes nothing: the back set sees no change
    // (common practice, no published source), though the store holds a new evaluation.
    store.operate({ kind: 'press-key', set: 'front', key: 2 });
    await wrapper.vm.$nextTick();
    expect(store.evaluation).not.toBe(evaluation);
    expect(seen.renders).toBe(0);
    // Lifting on that line lights its lamp on the back set too: then it renders.
    store.operate({ kind: 'lift-handset', set: 'front' });
    await wrapper.vm.$nextTick();
    expect(seen.renders).toBeGreaterThan(0);
    expect(wrapper.get('[data-testid="lamp-back-2"]').text()).toBe('steady');
  });

  it('does not re-render when the selection moves between other parts', async () => {
    const store = benchWith();
    const { seen, wrapper } = mountCountingBack();
    // A key pressed on a set selects that set: the other nodes on the drawing stay as they are.
    store.select('front');
    await wrapper.vm.$nextTick();
    store.select('bridge');
    await wrapper.vm.$nextTick();
    expect(seen.renders).toBe(0);
    store.select('back');
    await wrapper.vm.$nextTick();
    expect(wrapper.get('[data-testid="node-back"]').classes()).toContain('lb-node--selected');
  });
});
