/**
 * The Bench's three layouts by window width: phones (drawing with a bottom sheet of panels and one menu for the
 * tools), tablets and small laptops (tray and panels in drawers), and desktops (tray, drawing and panels side by
 * side).
 */
import { useBreakpoints } from '@vueuse/core';

/** Widths in CSS px where the layout changes: below 640 a phone, below 1100 too narrow for three columns. */
export const BENCH_BREAKPOINTS = { tablet: 640, desktop: 1100 } as const;

export function useBenchLayout() {
  const breakpoints = useBreakpoints(BENCH_BREAKPOINTS);
  return { phone: breakpoints.smaller('tablet'), compact: breakpoints.smaller('desktop') };
}
