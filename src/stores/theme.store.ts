/** Light or dark: remembered per browser, first guess from the operating system. */
import { defineStore } from 'pinia';
import { computed, ref, watch } from 'vue';

export type ThemeMode = 'light' | 'dark';
export const THEME_STORAGE_KEY = 'leadbench.theme';

function readStored(): ThemeMode | null {
  try {
    const value = globalThis.localStorage?.getItem(THEME_STORAGE_KEY);
    return value === 'light' || value === 'dark' ? value : null;
  } catch {
    return null;
  }
}

function systemPrefersDark(): boolean {
  return (
    typeof globalThis.matchMedia === 'function' &&
    globalThis.matchMedia('(prefers-color-scheme: dark)').matches
  );
}

export const useThemeStore = defineStore('theme', () => {
  const mode = ref<ThemeMode>(readStored() ?? (systemPrefersDark() ? 'dark' : 'light'));
  const isDark = computed(() => mode.value === 'dark');

  watch(
    mode,
    (value) => {
      try {
        globalThis.localStorage?.setItem(THEME_STORAGE_KEY, value);
      } catch {
        // Private windows may refuse storage; the choice then lasts for this visit only.
      }
    },
    // Synchronous so the choice is stored even if the tab closes right after the click.
    { flush: 'sync' },
  );

  function setMode(value: ThemeMode): void {
    mode.value = value;
  }

  function toggle(): void {
    mode.value = isDark.value ? 'light' : 'dark';
  }

  return { mode, isDark, setMode, toggle };
});
