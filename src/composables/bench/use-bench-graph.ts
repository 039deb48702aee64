/**
 * The Bench canvas's logic: the open plan as vue-flow nodes and cable edges, what the chosen finding lights and
 * dims, and what a drag, a connection or a drop from the Parts tray does to the plan. Every edit goes to the bench
 * store as one history step; the flow graph is rebuilt from the document, never edited behind the store's back.
 */
import { computed } from 'vue';
import { useVueFlow, type Connection, type NodeChange, type NodeDragEvent } from '@vue-flow/core';
import type { SimAction } from '@shared/engine';
import { useBenchStore } from '@/stores/bench.store';
import { planToEdges, planToNodes } from '@/components/bench/nodes/index';
import { PART_DRAG_TYPE, type PartRequest } from '@/components/bench/parts-tray';
import { DEFAULT_PART_SIZE, placePart, type Point, type Rect, type Size } from '@/bench/placement';
import { spliceAddOn } from '@/bench/plan-edits';
import { tierOf } from '@/components/bench/canvas-view';
import { FLOW_ID, tidyRoutes } from './use-tidy';

export { FLOW_ID };
export const GRID = 20;

/** Drawn sizes of parts not yet on the canvas, about what their nodes measure (an add-on is smaller). */
/**
 * Clear space beside a part: port labels stand outside a part's left and right edges ("Mounting cord ▸" is about
 * 100 px at the drawing's 12 px text), so two parts side by side keep room for one label of each.
 */
const SIDE_GAP = 6 * GRID;

const NEW_PART_SIZE: Record<PartRequest['kind'], Size> = {
  set: { width: 300, height: 240 },
  adapter: { width: 220, height: 120 },
  'add-on': { width: 220, height: 120 },
};

export interface CableEdgeData {
  cableId: string;
  /** On the chosen finding's conductor path. */
  lit: boolean;
  /** A finding is chosen and this cable is not on its path. */
  dimmed: boolean;
  /** Pairs of this cable on the path, e.g. "pair 23 tip". */
  pairs: string[];
  /** The route Tidy gave this cable, plug end first, while its parts stay where Tidy put them. */
  route?: Point[];
}

/** Resolves after `count` frames: long enough for a re-render, its layout and vue-flow's size measuring. */
function nextFrames(count: number): Promise<void> {
  return new Promise((resolve) => {
    const step = (left: number) => (left ? requestAnimationFrame(() => step(left - 1)) : resolve());
    step(count);
  });
}

export type DropOutcome =
  | { kind: 'place'; request: PartRequest; position: Point }
  | { kind: 'spliced'; id: string }
  | { kind: 'refused'; reason: string };

export function useBenchGraph() {
  const store = useBenchStore();
  const flow = useVueFlow(FLOW_ID);

  /** Only what the chosen finding's hops pass through, not every part the finding names. */
  const path = computed(() => {
    const finding = store.selectedFinding;
    const parts = new Set<string>();
    const cables = new Map<string, Set<string>>();
    for (const hop of finding?.path ?? []) {
      parts.add(hop.part);
      if (!hop.cable) continue;
      const pairs = cables.get(hop.cable) ?? new Set<string>();
      if (hop.pair) pairs.add(`pair ${hop.pair}${hop.conductor ? ` ${hop.conductor}` : ''}`);
      cables.set(hop.cable, pairs);
    }
    return { active: !!finding?.path.length, parts, cables };
  });

  const nodes = computed(() => {
    if (!store.plan) return [];
    const { active, parts } = path.value;
    return planToNodes(store.plan).map((n) => ({
      ...n,
      class: active ? (parts.has(n.id) ? 'lb-lit' : 'lb-dimmed') : undefined,
    }));
  });

  const edges = computed(() => {
    if (!store.plan) return [];
    const { active, cables } = path.value;
    return planToEdges(store.plan).map((e) => {
      const data: CableEdgeData = {
        cableId: e.id,
        lit: cables.has(e.id),
        dimmed: active && !cables.has(e.id),
        pairs: [...(cables.get(e.id) ?? [])],
        route: tidyRoutes.value[e.id],
      };
      return { ...e, data, class: data.dimmed ? 'lb-dimmed' : data.lit ? 'lb-lit' : undefined };
    });
  });

  function onDragStop(event: NodeDragEvent) {
    const moved = event.nodes.length ? event.nodes : [event.node];
    return store.moveParts(moved.map((n) => ({ id: n.id, position: n.position })));
  }

  /**
   * Keyboard users move a focused node with the arrow keys and select it with Enter: those arrive as node
   * changes, not drags or clicks, and are recorded the same way.
   */
  function onNodesChange(changes: NodeChange[]) {
    const moves: { id: string; position: Point }[] = [];
    for (const change of changes) {
      if (change.type === 'position' && change.dragging === false && change.position)
        moves.push({ id: change.id, position: change.position });
      if (change.type === 'select' && change.selected) store.select(change.id);
    }
    if (moves.length) store.moveParts(moves);
  }

  /** The refusal to show, or null when the cable was drawn. */
  function onConnect(connection: Connection): string | null {
    if (!connection.sourceHandle || !connection.targetHandle) return 'Drop the cable end on a labelled port.';
    const result = store.connect(
      { part: connection.source, port: connection.sourceHandle },
      { part: connection.target, port: connection.targetHandle },
    );
    return result.ok ? null : result.reason;
  }

  function operate(action: SimAction, setId?: string) {
    store.operate(action);
    if (setId) store.select(setId);
  }

  function pressKey(setId: string, index: number, kind: 'line' | 'hold') {
    operate(
      kind === 'hold' ? { kind: 'press-hold', set: setId } : { kind: 'press-key', set: setId, key: index },
      setId,
    );
  }

  /** Every part on the drawing as a box, with the size it is drawn at. */
  function taken(): Rect[] {
    return flow.getNodes.value.map((n) => ({
      x: n.position.x,
      y: n.position.y,
      width: n.dimensions.width || DEFAULT_PART_SIZE.width,
      height: n.dimensions.height || DEFAULT_PART_SIZE.height,
    }));
  }

  /** The part of the drawing the canvas shows now, in drawing coordinates. */
  function visibleBounds(): Rect {
    const el = document.querySelector(`[data-testid="${FLOW_ID}"]`);
    const box = el?.getBoundingClientRect();
    if (!box || !box.width || !box.height) return { x: -10000, y: -10000, width: 20000, height: 20000 };
    const a = flow.screenToFlowCoordinate({ x: box.left, y: box.top });
    const b = flow.screenToFlowCoordinate({ x: box.right, y: box.bottom });
    return { x: a.x, y: a.y, width: b.x - a.x, height: b.y - a.y };
  }

  /** The size a new part of `kind` will be drawn at: as big as the largest of its kind already drawn. */
  function newPartSize(kind: PartRequest['kind']): Size {
    const plan = store.plan;
    const list = kind === 'set' ? plan?.sets : kind === 'adapter' ? plan?.adapters : plan?.addOns;
    const ids = new Set(list?.map((p) => p.id));
    return flow.getNodes.value
      .filter((n) => ids.has(n.id))
      .reduce(
        (size, n) => ({
          width: Math.max(size.width, n.dimensions.width),
          height: Math.max(size.height, n.dimensions.height),
        }),
        NEW_PART_SIZE[kind],
      );
  }

  /** Where a part of `kind` wanted at `point` (drawing coordinates) lands: the nearest free spot in view. */
  function freeSpot(kind: PartRequest['kind'], point: Point): Point {
    return placePart(point, newPartSize(kind), taken(), visibleBounds(), { grid: GRID, gap: GRID, gapX: SIDE_GAP });
  }

  /** Where a part added from the tray by a click lands: the free spot nearest the middle of the view. */
  function viewCentre(kind: PartRequest['kind'] = 'set'): Point {
    const view = visibleBounds();
    return freeSpot(kind, { x: view.x + view.width / 2, y: view.y + view.height / 2 });
  }

  /** The set whose node lies under a drawing point, if any. */
  function setAt(point: Point): string | null {
    const sets = new Set(store.plan?.sets.map((s) => s.id));
    const hit = flow.getNodes.value.find(
      (n) =>
        sets.has(n.id) &&
        point.x >= n.position.x &&
        point.x <= n.position.x + n.dimensions.width &&
        point.y >= n.position.y &&
        point.y <= n.position.y + n.dimensions.height,
    );
    return hit?.id ?? null;
  }

  function onDragOver(event: DragEvent) {
    if (event.dataTransfer?.types.includes(PART_DRAG_TYPE)) {
      event.preventDefault();
      event.dataTransfer.dropEffect = 'copy';
    }
  }

  /**
   * A part dropped from the tray. An add-on dropped on a set is spliced into that set's cable here (one edit);
   * anything else is handed back with the free spot it should be placed at.
   */
  function onDrop(event: DragEvent): DropOutcome | null {
    const raw = event.dataTransfer?.getData(PART_DRAG_TYPE);
    if (!raw) return null;
    event.preventDefault();
    const request = JSON.parse(raw) as PartRequest;
    const point = flow.screenToFlowCoordinate({ x: event.clientX, y: event.clientY });
    const target = request.kind === 'add-on' ? setAt(point) : null;
    if (request.kind !== 'add-on' || !target)
      return { kind: 'place', request, position: freeSpot(request.kind, point) };
    return splice(request.template, target);
  }

  /** Splice a new add-on into a set's cable, placed beside the set on the cable's side. */
  function splice(template: string, setId: string): DropOutcome {
    if (store.readOnlyReason) return { kind: 'refused', reason: store.readOnlyReason };
    const plan = store.plan;
    const set = flow.findNode(setId);
    if (!plan || !set) return { kind: 'refused', reason: 'That set is not on the drawing.' };
    const beside = {
      x: set.position.x - NEW_PART_SIZE['add-on'].width,
      y: set.position.y + set.dimensions.height / 2,
    };
    const outcome = spliceAddOn(plan, template, setId, freeSpot('add-on', beside));
    if (!outcome.ok) return { kind: 'refused', reason: outcome.reason };
    store.commit(outcome.label, outcome.plan);
    const id = outcome.id ?? setId;
    store.select(id);
    return { kind: 'spliced', id };
  }

  /**
   * Fit the drawing, but never blow a small drawing (a lone KSU) up past life size. Parts draw more or less at each
   * zoom tier, so a fit that crosses a tier fits again once the parts have been measured at the new zoom, never
   * closer than before: a fit that would flip between two tiers settles on the lower zoom, where everything shows.
   */
  async function fit(duration = 200) {
    let maxZoom = 1;
    for (let round = 0; round < 3; round++) {
      const tier = tierOf(flow.viewport.value.zoom);
      await flow.fitView({ padding: 0.15, maxZoom, duration: round ? 0 : duration });
      const zoom = flow.viewport.value.zoom;
      if (tierOf(zoom) === tier) return;
      maxZoom = Math.min(maxZoom, zoom);
      await nextFrames(2);
    }
  }

  return {
    flow,
    nodes,
    edges,
    path,
    onDragStop,
    onNodesChange,
    onConnect,
    operate,
    pressKey,
    onDragOver,
    onDrop,
    splice,
    viewCentre,
    freeSpot,
    fit,
  };
}
