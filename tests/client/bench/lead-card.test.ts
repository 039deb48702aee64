import { describe, expect, it } from 'vitest';
import { defineComponent, h, nextTick } from 'vue';
import { mount } from '@vue/test-utils';
import { NMessageProvider } from 'naive-ui';
import LeadCard from '@/components/bench/LeadCard.vue';
import { benchWith } from './bench-fixture';

/** The Lead card in a message provider, its photos left out (they load from the server). */
function mountCard() {
  const removed: string[] = [];
  const duplicated: string[] = [];
  const Shell = defineComponent(
    () => () =>
      h(NMessageProvider, () =>
        h(LeadCard, {
          onRemove: (id: string) => removed.push(id),
          onDuplicate: (id: string) => duplicated.push(id),
        }),
      ),
  );
  const wrapper = mount(Shell, { global: { stubs: { PartPhotos: true } } });
  return { wrapper, removed, duplicated };
}

describe('the Lead card’s buttons', () => {
  it('remove the selected cable, duplicate or delete the selected part, and leave the KSU alone', async () => {
    const store = benchWith();
    const { wrapper, removed, duplicated } = mountCard();

    store.select('c-front');
    await nextTick();
    expect(wrapper.find('[data-testid="duplicate-part"]').exists()).toBe(false);
    expect(wrapper.get('[data-testid="remove-part"]').text()).toBe('Remove cable');
    await wrapper.get('[data-testid="remove-part"]').trigger('click');

    store.select('front');
    await nextTick();
    expect(wrapper.get('[data-testid="remove-part"]').text()).toBe('Delete');
    await wrapper.get('[data-testid="duplicate-part"]').trigger('click');
    await wrapper.get('[data-testid="remove-part"]').trigger('click');
    expect(wrapper.find('[data-testid="lead-row-1"]').exists()).toBe(true);

    // The KSU is part of every plan: the card offers neither button for it.
    store.select('ksu');
    await nextTick();
    expect(wrapper.find('[data-testid="remove-part"]').exists()).toBe(false);
    expect(wrapper.find('[data-testid="duplicate-part"]').exists()).toBe(false);

    expect(removed).toEqual(['c-front', 'front']);
    expect(duplicated).toEqual(['front']);
  });
});
