/**
 * What every naive-ui tree is configured with: the product theme, light or dark, and our own words in place of
 * the kit's default texts. The light theme is naive-ui's built-in default (its `lightTheme` object would pull
 * in every component's styles); the dark one is fetched when first needed.
 */
import type { Pinia } from 'pinia';
import { computed, shallowRef, watch, type ComputedRef } from 'vue';
import { createLocale, enUS, type ConfigProviderProps, type GlobalTheme } from 'naive-ui';
import { useThemeStore } from '@/stores/theme.store';
import { darkThemeOverrides, themeOverrides } from '@/theme';

/** The kit's English texts with its placeholders and page-size words replaced by ours. */
export const benchLocale = createLocale(
  {
    Input: { placeholder: '' },
    InputNumber: { placeholder: '' },
    Select: { placeholder: 'Choose one' },
    TimePicker: { placeholder: 'Choose a time' },
    Pagination: { goto: 'Go to page', selectionSuffix: 'per page' },
    Empty: { description: 'Nothing here yet' },
  },
  enUS,
);

const darkTheme = shallowRef<GlobalTheme | null>(null);
let darkLoading: Promise<void> | null = null;

function loadDarkTheme(): Promise<void> {
  darkLoading ??= import('./naive-dark-theme').then((m) => {
    darkTheme.value = m.darkTheme;
  });
  return darkLoading;
}

export function useNaiveConfig(pinia?: Pinia): {
  props: ComputedRef<ConfigProviderProps>;
  /** False while the dark theme is still on its way; render nothing themed until then, so nothing flashes light. */
  ready: ComputedRef<boolean>;
} {
  const theme = useThemeStore(pinia);
  watch(
    () => theme.isDark,
    (dark) => {
      if (dark) void loadDarkTheme();
    },
    { immediate: true },
  );
  const props = computed<ConfigProviderProps>(() =>
    theme.isDark && darkTheme.value
      ? { theme: darkTheme.value, themeOverrides: darkThemeOverrides, locale: benchLocale }
      : { theme: null, themeOverrides, locale: benchLocale },
  );
  const ready = computed(() => !theme.isDark || darkTheme.value !== null);
  return { props, ready };
}
