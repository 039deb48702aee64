/**
 * Tidy: lay the installation out automatically as one undoable step. ELK and the layout over it are loaded only
 * when Tidy is first used, so they stay out of the first bundle. The routes it gives the cables are kept here for
 * the canvas to draw while the parts stay where Tidy put them (a cable edge falls back to its own route once an
 * end moves).
 */
import { ref, shallowRef } from 'vue';
import { useVueFlow } from '@vue-flow/core';
import { useBenchStore, type EditResult } from '@/stores/bench.store';
import { moveParts } from '@/bench/plan-edits';
import type { Point } from '@/bench/placement';
import type { ElkEngine, tidyLayout } from '@/bench/tidy-layout';

/** The last Tidy's cable routes, by cable id, in drawing coordinates. */
export const tidyRoutes = shallowRef<Record<string, Point[]>>({});

let loaded: Promise<{ elk: ElkEngine; layOut: typeof tidyLayout }> | null = null;
function loadTidy(): Promise<{ elk: ElkEngine; layOut: typeof tidyLayout }> {
  loaded ??= Promise.all([import('elkjs/lib/elk.bundled.js'), import('@/bench/tidy-layout')]).then(
    ([{ default: ELK }, { tidyLayout: layOut }]) => ({ elk: new ELK(), layOut }),
  );
  return loaded;
}

/** The canvas's vue-flow id: Tidy reads the drawn sizes of the parts from it. */
export const FLOW_ID = 'bench-canvas';

export const TIDY_LABEL = 'Tidy the drawing';

export function useTidy() {
  const store = useBenchStore();
  const flow = useVueFlow(FLOW_ID);
  const busy = ref(false);

  async function tidy(): Promise<EditResult> {
    if (store.readOnlyReason) return { ok: false, reason: store.readOnlyReason };
    const plan = store.plan;
    if (!plan) return { ok: false, reason: 'No plan is open.' };
    busy.value = true;
    try {
      const { elk, layOut } = await loadTidy();
      const layout = await layOut(elk, plan, (id) => {
        const size = flow.findNode(id)?.dimensions;
        return size?.width && size.height ? { width: size.width, height: size.height } : undefined;
      });
      if (store.plan !== plan)
        return { ok: false, reason: 'The drawing changed while it was being tidied: try again.' };
      const outcome = moveParts(plan, layout.positions);
      if (!outcome.ok) return outcome;
      tidyRoutes.value = layout.routes;
      store.commit(TIDY_LABEL, outcome.plan);
      setTimeout(() => void flow.fitView({ padding: 0.15, maxZoom: 1, duration: 200 }), 50);
      return { ok: true };
    } catch (err) {
      return {
        ok: false,
        reason: `The drawing could not be tidied: ${err instanceof Error ? err.message : String(err)}`,
      };
    } finally {
      busy.value = false;
    }
  }

  return { tidy, busy };
}
