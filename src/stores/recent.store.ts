/** The plan last opened on the Bench, so the top bar can offer a way back to it (kept per browser). */
import { defineStore } from 'pinia';
import { useLocalStorage } from '@vueuse/core';

export const LAST_PLAN_KEY = 'leadbench.lastPlan';

export const useRecentStore = defineStore('recent', () => {
  // VueUse storage: null removes the entry; refused storage keeps the shortcut for this visit only.
  const lastPlanId = useLocalStorage<string | null>(LAST_PLAN_KEY, null, { writeDefaults: false });

  function rememberPlan(id: string): void {
    lastPlanId.value = id;
  }

  /** Called when a plan is deleted or turns out to be gone. */
  function forgetPlan(id: string): void {
    if (lastPlanId.value === id) lastPlanId.value = null;
  }

  return { lastPlanId, rememberPlan, forgetPlan };
});
