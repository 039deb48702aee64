/**
 * The route loading bar. It is naive-ui's, but the first page must not wait for the component kit: the bar is
 * fetched after the first navigation and shows from the second on (the first page has nothing to replace yet).
 */
import type { Pinia } from 'pinia';
import type { NavigationProgress } from '@/router';

type BarCall = keyof NavigationProgress;

export function lazyLoadingBar(pinia: Pinia): NavigationProgress {
  let first = true;
  let chain: Promise<void> = Promise.resolve();
  let bar: Promise<NavigationProgress> | null = null;
  const call = (method: BarCall) => {
    if (first) {
      if (method !== 'start') first = false;
      return;
    }
    bar ??= import('./app-kit')
      .then((kit) => kit.loadLoadingBar())
      .then((m) => m.createLoadingBar(pinia));
    const loaded = bar;
    chain = chain.then(async () => (await loaded)[method]()).catch(() => undefined);
  };
  return { start: () => call('start'), finish: () => call('finish'), error: () => call('error') };
}
