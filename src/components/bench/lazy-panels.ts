/**
 * The Bench's side panels after Findings, fetched the first time they are shown. The tab strip keeps every panel
 * mounted under `v-show`, so sound and sweep results survive switching; each stand-in here renders an empty box
 * while its pane is hidden, and loads its panel (and keeps it mounted) once the pane is first displayed. The Bench
 * then opens with the drawing and the findings only, and the rest follows on use.
 */
import { defineAsyncComponent, defineComponent, h, onBeforeUnmount, onMounted, ref, type Component } from 'vue';

/** The nearest ancestor that `v-show` hides (an inline `display: none`), or null when the box is displayed. */
function hiddenAncestor(el: HTMLElement): HTMLElement | null {
  for (let node: HTMLElement | null = el; node; node = node.parentElement) {
    if (node.style.display === 'none') return node;
  }
  return null;
}

/** Typed as the panel itself: the stand-in passes every prop and listener on to it. */
function whenShown<T extends Component>(name: string, loader: () => Promise<{ default: T }>): T {
  const Panel = defineAsyncComponent(loader);
  const standIn = defineComponent({
    name,
    inheritAttrs: false,
    setup(_, { attrs }) {
      const shown = ref(false);
      const box = ref<HTMLElement | null>(null);
      let watcher: MutationObserver | null = null;

      function check() {
        const el = box.value;
        const hidden = el ? hiddenAncestor(el) : null;
        watcher?.disconnect();
        watcher = null;
        if (!el || !hidden) {
          shown.value = true;
          return;
        }
        // Watch the pane that hides it; v-show shows it by changing that style.
        watcher = new MutationObserver(check);
        watcher.observe(hidden, { attributes: true, attributeFilter: ['style'] });
      }

      onMounted(check);
      onBeforeUnmount(() => watcher?.disconnect());
      return () => (shown.value ? h(Panel, attrs) : h('div', { ref: box }));
    },
  });
  return standIn as unknown as T;
}

export const LeadCard = whenShown('LeadCard', () => import('./LeadCard.vue'));
export const HandsetPanel = whenShown('HandsetPanel', () => import('./HandsetPanel.vue'));
export const SweepPanel = whenShown('SweepPanel', () => import('./SweepPanel.vue'));
export const CurePanel = whenShown('CurePanel', () => import('./CurePanel.vue'));
