import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import OperatingPanel from '@/components/bench/OperatingPanel.vue';
import { benchWith } from './bench-fixture';

describe('OperatingPanel', () => {
  it('lifts the handset, latches a line key, holds the line and closes on Escape', async () => {
    const store = benchWith();
    const wrapper = mount(OperatingPanel, { props: { setId: 'front' } });
    const observed = () => store.evaluation?.sets.find((s) => s.set === 'front');

    await wrapper.get('[data-testid="operate-handset-front"]').trigger('click');
    expect(observed()?.offHook).toBe(true);
    expect(wrapper.get('[data-testid="operate-handset-front"]').text()).toBe('Hang up Front desk');

    await wrapper.get('[data-testid="operate-key-front-2"]').trigger('click');
    expect(observed()?.pressedKey).toBe(2);
    expect(wrapper.get('[data-testid="operate-key-front-2"]').attributes('aria-pressed')).toBe('true');

    // The six-key set's sixth key is its hold key: it holds the line in use and releases the line key
    // (common practice for key telephone sets, no published source).
    await wrapper.get('[data-testid="operate-key-front-6"]').trigger('click');
    expect(observed()?.pressedKey).toBeNull();
    expect(store.sim?.lines.find((l) => l.line === 2)?.circuit).toBe('held');

    await wrapper.get('[data-testid="operating-panel"]').trigger('keydown', { key: 'Enter' });
    expect(wrapper.emitted('close')).toBeUndefined();
    await wrapper.get('[data-testid="operate-key-front-1"]').trigger('keydown', { key: 'Escape' });
    expect(wrapper.emitted('close')).toHaveLength(1);
  });
});
