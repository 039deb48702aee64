/** The component kit speaks our words, not its defaults ("Please Input", "Please Select", "20 / page"). */
import { describe, expect, it } from 'vitest';
import { defineComponent, h } from 'vue';
import { mount } from '@vue/test-utils';
import { NConfigProvider, NInput, NPagination, NSelect } from 'naive-ui';
import { benchLocale } from '@/plugins/naive-config';

describe('component kit words', () => {
  it('shows no default placeholder or page-size wording under our locale', async () => {
    const Page = defineComponent(
      () => () =>
        h(NConfigProvider, { locale: benchLocale }, () => [
          h(NInput),
          h(NSelect, { options: [{ label: 'One', value: 1 }] }),
          h(NPagination, { itemCount: 100, pageSizes: [10, 20], showSizePicker: true, pageSize: 20 }),
        ]),
    );
    const wrapper = mount(Page, { attachTo: document.body });
    await wrapper.vm.$nextTick();
    const html = document.body.innerHTML;
    // The kit's own English defaults (naive-ui 2.45 locales/common/enUS).
    expect(html).not.toContain('Please Input');
    expect(html).not.toContain('Please Select');
    expect(html).not.toContain('20 / page');
    expect(html).toContain('Choose one');
    wrapper.unmount();
  });
});
