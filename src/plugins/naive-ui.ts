/**
 * naive-ui pieces that live outside the component tree: the route loading bar.
 * It follows the same theme as the app through the theme store.
 */
import type { Pinia } from 'pinia';
import { computed } from 'vue';
import { createDiscreteApi, darkTheme, lightTheme, type ConfigProviderProps } from 'naive-ui';
import { useThemeStore } from '@/stores/theme.store';
import { darkThemeOverrides, themeOverrides } from '@/theme';

export function themeFor(isDark: boolean): Pick<ConfigProviderProps, 'theme' | 'themeOverrides'> {
  return isDark
    ? { theme: darkTheme, themeOverrides: darkThemeOverrides }
    : { theme: lightTheme, themeOverrides: themeOverrides };
}

export function createDiscrete(pinia: Pinia) {
  const theme = useThemeStore(pinia);
  const configProviderProps = computed<ConfigProviderProps>(() => themeFor(theme.isDark));
  return createDiscreteApi(['loadingBar'], { configProviderProps });
}
