/**
 * Every control of the KSU, on its canvas node and in the parts tray, has a name a screen reader can speak
 * (WCAG 2.1, 4.1.2 Name, Role, Value; axe rule button-name).
 */
import { describe, expect, it } from 'vitest';
import { defineComponent, h } from 'vue';
import { mount, type VueWrapper } from '@vue/test-utils';
import { NMessageProvider } from 'naive-ui';
import KsuNode from '@/components/bench/nodes/KsuNode.vue';
import PartsTray from '@/components/bench/PartsTray.vue';
import { benchWith, mountNode, twoSetPlan } from './bench/bench-fixture';

/** A button's accessible name, as far as these controls give one: aria-label, else its text. */
function accessibleName(button: Element): string {
  return (button.getAttribute('aria-label') ?? button.textContent ?? '').replace(/\s+/g, ' ').trim();
}

function buttonNames(wrapper: VueWrapper): string[] {
  return wrapper.findAll('button').map((b) => accessibleName(b.element));
}

describe('KSU controls have names', () => {
  it('names every button on the KSU node', () => {
    const store = benchWith(twoSetPlan());
    const wrapper = mountNode(KsuNode, store.plan!.ksu.id, 'ksu', { width: 250, height: 300 });
    const names = buttonNames(wrapper);
    expect(names.length).toBeGreaterThan(store.plan!.ksu.lines.length);
    expect(names.filter((n) => n === '')).toEqual([]);
    expect(names).toContain('Ring line 1: an incoming call');
    wrapper.unmount();
  });

  it('names the − and + buttons of the KSU sizes in the parts tray', async () => {
    benchWith(twoSetPlan());
    const Shell = defineComponent(() => () => h(NMessageProvider, () => h(PartsTray)));
    const wrapper = mount(Shell);
    await wrapper.vm.$nextTick();
    const lines = wrapper.get('[data-testid="palette-ksu"]');
    const names = lines.findAll('button').map((b) => accessibleName(b.element));
    expect(names.filter((n) => n === '')).toEqual([]);
    expect(names).toEqual(
      expect.arrayContaining(['Fewer lines', 'More lines', 'Fewer station ports', 'More station ports']),
    );
    wrapper.unmount();
  });
});
