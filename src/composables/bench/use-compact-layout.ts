/** True when the window is too narrow for tray, canvas and panels side by side (tablets, small laptops). */
import { onBeforeUnmount, onMounted, ref } from 'vue';

export const COMPACT_QUERY = '(max-width: 1099px)';

export function useCompactLayout(query = COMPACT_QUERY) {
  const media = typeof window !== 'undefined' && window.matchMedia ? window.matchMedia(query) : null;
  const compact = ref(media?.matches ?? false);
  const update = (e: MediaQueryListEvent) => (compact.value = e.matches);
  onMounted(() => media?.addEventListener('change', update));
  onBeforeUnmount(() => media?.removeEventListener('change', update));
  return compact;
}
