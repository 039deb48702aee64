import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import LeadTable from '@/components/bench/LeadTable.vue';
import { benchWith } from './bench-fixture';

describe('LeadTable', () => {
  it('lists all 25 pairs with tip and ring colour names', () => {
    benchWith();
    const wrapper = mount(LeadTable, { props: { partId: 'front' } });
    const rows = wrapper.findAll('[data-testid^="lead-row-"]');
    expect(rows).toHaveLength(25);
    // Colour code of 25-pair cable, ICEA S-80-576: tip colours white, red, black, yellow, violet by groups of five;
    // ring colours blue, orange, green, brown, slate within each group.
    const expected: Record<number, [string, string]> = {
      1: ['white', 'blue'],
      5: ['white', 'slate'],
      6: ['red', 'blue'],
      13: ['black', 'green'],
      17: ['yellow', 'orange'],
      24: ['violet', 'brown'],
      25: ['violet', 'slate'],
    };
    for (const [pair, [tip, ring]] of Object.entries(expected)) {
      const colours = wrapper.get(`[data-testid="lead-row-${pair}"] .lb-leads__colours`).text();
      expect(colours).toContain(tip);
      expect(colours).toContain(ring);
    }
  });

  it('lifting a pair adds a lead change to the document and restoring removes it', async () => {
    const store = benchWith();
    const wrapper = mount(LeadTable, { props: { partId: 'front' } });
    const lift = wrapper.get('[data-testid="lead-lift-2"]');
    await lift.setValue('both');
    expect(store.plan?.sets.find((s) => s.id === 'front')?.leadChanges).toEqual([
      { kind: 'lift', pair: 2, conductor: 'both' },
    ]);
    expect(wrapper.get('[data-testid="lead-state-2"]').text()).toBe('lifted');
    expect(store.undoLabel).toBe('Lift pair 2 in Front desk');

    await wrapper.get('[data-testid="lead-restore-2"]').trigger('click');
    expect(store.plan?.sets.find((s) => s.id === 'front')?.leadChanges).toEqual([]);
    expect(wrapper.get('[data-testid="lead-state-2"]').text()).toBe('connected');
  });

  it('moves a pair to a spare pair and names the move', async () => {
    const store = benchWith();
    const wrapper = mount(LeadTable, { props: { partId: 'back' } });
    // Pair 17 is spare on the six-key set (its template description: "Pairs 17 and 19–25 are spare").
    await wrapper.get('[data-testid="lead-move-18"]').setValue('17');
    expect(store.plan?.sets.find((s) => s.id === 'back')?.leadChanges).toEqual([
      { kind: 'move', pair: 18, toPair: 17 },
    ]);
    expect(wrapper.get('[data-testid="lead-state-18"]').text()).toBe('moved to pair 17');
    expect(wrapper.get('[data-testid="lead-row-17"]').text()).toContain('carries the leads of pair 18');
  });
});
