/**
 * What the drawing shows at the present zoom, which part holds the drawing's one tab stop, and which set is
 * open in the operating panel. One Bench is open at a time, so this is module state shared by the node
 * components and the drawing around the canvas.
 */
import { computed, reactive } from 'vue';
import type { Plan } from '@shared/engine';
import { stepTo, type StepCommand } from './bench-keys';

/** Node text is at least 12 px: at this zoom and above it renders at 11 px or more (WCAG 1.4.4 practice). */
export const DETAIL_ZOOM = 0.92;
/** Below this zoom even the overview's few words would need more room than a node has: names only. */
export const FAR_ZOOM = 0.4;

export type CanvasTier = 'detail' | 'overview' | 'far';

export function tierOf(zoom: number): CanvasTier {
  if (zoom >= DETAIL_ZOOM) return 'detail';
  return zoom >= FAR_ZOOM ? 'overview' : 'far';
}

export const canvasView = reactive({
  zoom: 1,
  /** The part whose node takes Tab into the drawing (roving tab stop). */
  activePart: null as string | null,
  /** The part whose own controls are in the tab order (after Enter on it). */
  enteredPart: null as string | null,
  /** The set shown in the operating panel. */
  openSet: null as string | null,
});

export const canvasTier = computed(() => tierOf(canvasView.zoom));

export function resetCanvasView(): void {
  canvasView.activePart = null;
  canvasView.enteredPart = null;
  canvasView.openSet = null;
}

/** Tab index of a control inside a part's node: only reachable by Tab once the user entered that part. */
export function innerTabindex(partId: string): 0 | -1 {
  return canvasView.enteredPart === partId ? 0 : -1;
}

export interface PartStop {
  id: string;
  kind: 'ksu' | 'adapter' | 'set' | 'add-on';
}

/** Every part in reading order of the drawing: left to right, then top to bottom. */
export function partsInReadingOrder(plan: Plan): PartStop[] {
  const stops: (PartStop & { x: number; y: number })[] = [
    { id: plan.ksu.id, kind: 'ksu', ...(plan.ksu.position ?? { x: 0, y: 0 }) },
    ...plan.adapters.map((a) => ({ id: a.id, kind: 'adapter' as const, ...(a.position ?? { x: 0, y: 0 }) })),
    ...plan.sets.map((s) => ({ id: s.id, kind: 'set' as const, ...(s.position ?? { x: 0, y: 0 }) })),
    ...plan.addOns.map((a) => ({ id: a.id, kind: 'add-on' as const, ...(a.position ?? { x: 0, y: 0 }) })),
  ];
  return stops.sort((a, b) => a.x - b.x || a.y - b.y).map(({ id, kind }) => ({ id, kind }));
}

/** The part that holds the tab stop: the remembered one while it exists, else the first set, else the first part. */
export function currentStop(plan: Plan): string | null {
  const order = partsInReadingOrder(plan);
  if (canvasView.activePart && order.some((p) => p.id === canvasView.activePart))
    return canvasView.activePart;
  return (order.find((p) => p.kind === 'set') ?? order[0])?.id ?? null;
}

/** Where a step key of the drawing (PART_KEYS) moves the tab stop from `from`. */
export function nextStop(order: readonly PartStop[], from: string, to: StepCommand): string | null {
  const i = order.findIndex((p) => p.id === from);
  return i < 0 ? null : order[stepTo(order.length, i, to)].id;
}
