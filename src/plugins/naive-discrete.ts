/** naive-ui pieces that live outside the component tree (the route loading bar), on the app's theme. */
import type { Pinia } from 'pinia';
import { createDiscreteApi } from 'naive-ui';
import type { NavigationProgress } from '@/router';
import { useNaiveConfig } from './naive-config';

export function createLoadingBar(pinia: Pinia): NavigationProgress {
  const { props } = useNaiveConfig(pinia);
  return createDiscreteApi(['loadingBar'], { configProviderProps: props }).loadingBar;
}
