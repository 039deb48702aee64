/** True when the window is too narrow for tray, canvas and panels side by side (tablets, small laptops). */
import { useMediaQuery } from '@vueuse/core';

export const COMPACT_QUERY = '(max-width: 1099px)';

export function useCompactLayout(query = COMPACT_QUERY) {
  return useMediaQuery(query);
}
