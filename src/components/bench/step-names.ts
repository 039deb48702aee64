/**
 * `v-step-names="'lines'"` on a naive-ui number field: its − and + buttons are icons only, with no name for a
 * screen reader; this names them "Fewer lines" and "More lines" (WCAG 2.1, 4.1.2 Name, Role, Value).
 */
import type { Directive } from 'vue';

function name(el: HTMLElement, what: string): void {
  // The kit renders the − button before the + button whatever their placement.
  const [minus, plus] = el.querySelectorAll<HTMLButtonElement>('button');
  minus?.setAttribute('aria-label', `Fewer ${what}`);
  plus?.setAttribute('aria-label', `More ${what}`);
}

export const vStepNames: Directive<HTMLElement, string> = {
  mounted: (el, binding) => name(el, binding.value),
  updated: (el, binding) => name(el, binding.value),
};
