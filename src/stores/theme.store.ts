/** Light or dark: remembered per browser (VueUse storage), following the operating system until chosen. */
import { defineStore } from 'pinia';
import { computed } from 'vue';
import { useLocalStorage, usePreferredDark } from '@vueuse/core';

export type ThemeMode = 'light' | 'dark';
export const THEME_STORAGE_KEY = 'leadbench.theme';

const isMode = (value: unknown): value is ThemeMode => value === 'light' || value === 'dark';

export const useThemeStore = defineStore('theme', () => {
  // Private windows may refuse storage; VueUse then keeps the choice for this visit only.
  const stored = useLocalStorage<ThemeMode | null>(THEME_STORAGE_KEY, null, {
    serializer: { read: (raw) => (isMode(raw) ? raw : null), write: (value) => value ?? '' },
    writeDefaults: false,
    // Synchronous so the choice is stored even if the tab closes right after the click.
    flush: 'sync',
  });
  const systemDark = usePreferredDark();
  const mode = computed<ThemeMode>(() => stored.value ?? (systemDark.value ? 'dark' : 'light'));
  const isDark = computed(() => mode.value === 'dark');

  function setMode(value: ThemeMode): void {
    stored.value = value;
  }

  function toggle(): void {
    stored.value = isDark.value ? 'light' : 'dark';
  }

  return { mode, isDark, setMode, toggle };
});
