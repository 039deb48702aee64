/**
 * The guest bench's drawing, kept in this tab only (VueUse session storage, so closing the tab forgets it), so a
 * visitor who creates an account keeps the work: after sign-up it is saved as the new account's plan.
 */
import type { Ref } from 'vue';
import { useSessionStorage, type Serializer } from '@vueuse/core';
import { useMutation } from '@tanstack/vue-query';
import { PlanSchema, type Plan } from '@shared/engine/documents';
import { plansApi } from '@/api/plans';

export const GUEST_PLAN_KEY = 'leadbench.guestPlan';
/** Where the guest bench's offer sends sign-up and sign-in on to; after either, the kept plan is saved. */
export const GUEST_KEEP_NEXT = '/try?keep=1';

const planSerializer: Serializer<Plan | null> = {
  read(raw) {
    try {
      const parsed = PlanSchema.safeParse(JSON.parse(raw));
      return parsed.success ? parsed.data : null;
    } catch {
      return null;
    }
  },
  write: (value) => JSON.stringify(value),
};

export function useGuestPlan(): Ref<Plan | null> {
  return useSessionStorage<Plan | null>(GUEST_PLAN_KEY, null, {
    serializer: planSerializer,
    shallow: true,
    writeDefaults: false,
    flush: 'sync',
  });
}

/** Save the kept guest drawing as a plan of the user just signed in: its id, or null when there is none or it failed. */
export function useKeepGuestPlan(): () => Promise<string | null> {
  const kept = useGuestPlan();
  const create = useMutation({ mutationFn: (document: Plan) => plansApi.create(document) });
  return async () => {
    const document = kept.value;
    if (!document) return null;
    try {
      const record = await create.mutateAsync(document);
      kept.value = null;
      return record.id;
    } catch {
      // The drawing stays kept: the guest bench (the `next` page) opens it again.
      return null;
    }
  };
}
