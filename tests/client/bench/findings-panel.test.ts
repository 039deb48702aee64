import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { PlanSchema } from '@shared/engine';
import demo from '@shared/engine/examples/demo-plan.json';
import FindingsPanel from '@/components/bench/FindingsPanel.vue';
import { benchWith } from './bench-fixture';

describe('FindingsPanel', () => {
  it('lists the findings in words and lights the chosen one’s path with pair colours named', async () => {
    const store = benchWith(PlanSchema.parse(demo));
    const wrapper = mount(FindingsPanel);
    const items = wrapper.findAll('[data-testid^="finding-"]');
    expect(items.length).toBe(store.findings.length);
    expect(items.length).toBeGreaterThan(0);
    // The demo's hands-free wiring shares the private talk pair 23 between sets: a path through its tip exists.
    const index = store.findings.findIndex((f) => f.path.some((h) => h.pair === 23 && h.conductor === 'tip'));
    expect(index).toBeGreaterThanOrEqual(0);
    const first = store.findings[index];
    expect(items[index].text()).toContain(first.message);
    expect(items[index].text()).toMatch(/^(Fault|Warning):/);

    await items[index].trigger('click');
    expect(store.selectedFinding).toEqual(first);
    for (const hop of first.path) expect(store.highlight.parts.has(hop.part)).toBe(true);
    const cables = first.path.flatMap((h) => (h.cable ? [h.cable] : []));
    for (const c of cables) expect(store.highlight.cables.has(c)).toBe(true);

    // The demo's speaker is bridged onto the front counter's cord and both reach the workroom through the adapter.
    expect(wrapper.get('[data-testid="finding-sentence"]').text()).toBe(
      'The conductors of Front counter and Workroom meet on pair 23 (violet-green) tip (the violet conductor), through Counter speaker and Bridging adapter.',
    );
    // Pair 23 is violet-green and its tip is violet (ICEA S-80-576 colour code).
    const strip = wrapper.findAll('[data-testid="finding-strip"] > li').map((li) => li.text());
    expect(strip).toEqual([
      'Front counter',
      '23 violet-green tip',
      'Counter speaker',
      'Bridging adapter',
      'Workroom',
    ]);

    expect(wrapper.findAll('.lb-hop')).toHaveLength(0);
    await wrapper.get('[data-testid="finding-hops-toggle"]').trigger('click');
    const hops = wrapper.findAll('.lb-hop');
    expect(hops).toHaveLength(first.path.length);
    // Each hop is said once: its own words and nothing repeated beside them.
    hops.forEach((hop, i) => expect(hop.text()).toBe(first.path[i].text));

    await items[index].trigger('click');
    expect(store.selectedFinding).toBeNull();
    expect(store.highlight.parts.size).toBe(0);
  });
});
