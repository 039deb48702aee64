/** The plan last opened on the Bench, so the top bar can offer a way back to it. */
import { defineStore } from 'pinia';
import { ref } from 'vue';

export const LAST_PLAN_KEY = 'leadbench.lastPlan';

function readStored(): string | null {
  try {
    return globalThis.localStorage?.getItem(LAST_PLAN_KEY) ?? null;
  } catch {
    return null;
  }
}

function writeStored(id: string | null): void {
  try {
    if (id === null) globalThis.localStorage?.removeItem(LAST_PLAN_KEY);
    else globalThis.localStorage?.setItem(LAST_PLAN_KEY, id);
  } catch {
    // Storage refused: the shortcut lasts for this visit only.
  }
}

export const useRecentStore = defineStore('recent', () => {
  const lastPlanId = ref<string | null>(readStored());

  function rememberPlan(id: string): void {
    lastPlanId.value = id;
    writeStored(id);
  }

  /** Called when a plan is deleted or turns out to be gone. */
  function forgetPlan(id: string): void {
    if (lastPlanId.value !== id) return;
    lastPlanId.value = null;
    writeStored(null);
  }

  return { lastPlanId, rememberPlan, forgetPlan };
});
