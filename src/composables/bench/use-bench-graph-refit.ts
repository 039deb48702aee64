/**
 * The drawing keeps fitting its window until the user moves it: a phone turned on its side, a window resized or a
 * panel that narrows the canvas refits the drawing (debounced, once the size has settled). Panning or zooming by
 * hand (pointer, wheel, pinch, the zoom buttons) or opening a set in the operating panel leaves the view alone;
 * fitting again (the Fit button, F) hands the view back.
 */
import { ref, type Ref } from 'vue';
import { useDebounceFn, useResizeObserver } from '@vueuse/core';
import type { VueFlowStore } from '@vue-flow/core';
import { canvasView } from '@/components/bench/canvas-view';

/** Long enough for a rotation or a window drag to finish, short enough to feel like part of it. */
export const REFIT_DELAY_MS = 150;

export function useRefitOnResize(
  target: Ref<HTMLElement | null>,
  flow: VueFlowStore,
  fit: (duration: number) => unknown,
) {
  const movedByHand = ref(false);
  let size: { width: number; height: number } | null = null;

  // vue-flow reports a move start only for the user's own pan and zoom; a programmatic fit or centre has no source.
  flow.onMoveStart(() => (movedByHand.value = true));

  const refit = useDebounceFn(() => {
    if (!movedByHand.value && !canvasView.openSet) void fit(0);
  }, REFIT_DELAY_MS);

  useResizeObserver(target, ([entry]) => {
    const { width, height } = entry.contentRect;
    const first = size === null;
    const same = size?.width === width && size.height === height;
    size = { width, height };
    // The first size is the one the drawing opened at (fitted on pane-ready); a zero size is a hidden canvas.
    if (first || same || !width || !height) return;
    void refit();
  });

  return {
    movedByHand,
    /** The user zoomed with a button: the view is theirs now. */
    byHand: () => (movedByHand.value = true),
    /** The drawing was fitted: it follows the window again. */
    fitted: () => (movedByHand.value = false),
  };
}
